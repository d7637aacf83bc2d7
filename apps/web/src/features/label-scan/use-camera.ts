import { useEffect, useState } from 'react';

/** Where the camera is: each state has its own words in the scan view. */
export type CameraState =
  'asking' | 'scanning' | 'denied' | 'no-camera' | 'insecure' | 'busy' | 'failed';

function stateOfError(error: unknown): CameraState {
  const name = error instanceof DOMException || error instanceof Error ? error.name : '';
  if (name === 'NotAllowedError' || name === 'SecurityError') return 'denied';
  if (name === 'NotFoundError' || name === 'OverconstrainedError') return 'no-camera';
  if (name === 'NotReadableError' || name === 'AbortError') return 'busy';
  return 'failed';
}

/**
 * Opens the camera (the rear one where there is a choice) into `videoRef` while mounted, and
 * stops every track when unmounted or when `attempt` changes (Try again asks anew).
 */
export function useCamera(
  videoRef: React.RefObject<HTMLVideoElement | null>,
  attempt: number,
): CameraState {
  // Browsers offer the camera only to pages served over HTTPS (or from localhost).
  const unavailable: CameraState | null =
    typeof navigator.mediaDevices?.getUserMedia === 'function'
      ? null
      : window.isSecureContext
        ? 'no-camera'
        : 'insecure';
  const [answer, setAnswer] = useState<{ attempt: number; state: CameraState } | null>(null);

  useEffect(() => {
    if (unavailable) return;
    let stopped = false;
    let stream: MediaStream | null = null;
    navigator.mediaDevices
      .getUserMedia({ video: { facingMode: { ideal: 'environment' } }, audio: false })
      .then(async (opened) => {
        stream = opened;
        if (stopped) {
          opened.getTracks().forEach((track) => track.stop());
          return;
        }
        const video = videoRef.current;
        if (video) {
          video.srcObject = opened;
          await video.play().catch(() => undefined);
        }
        setAnswer({ attempt, state: 'scanning' });
      })
      .catch((error: unknown) => {
        if (!stopped) setAnswer({ attempt, state: stateOfError(error) });
      });
    return () => {
      stopped = true;
      stream?.getTracks().forEach((track) => track.stop());
    };
  }, [videoRef, attempt, unavailable]);

  return unavailable ?? (answer?.attempt === attempt ? answer.state : 'asking');
}

/**
 * Whether to offer the scan button: on a touch screen (phone, tablet) always, elsewhere when
 * the browser lists a camera.
 */
export function useCameraLikely(): boolean {
  const [likely, setLikely] = useState(
    () => typeof window.matchMedia === 'function' && window.matchMedia('(pointer: coarse)').matches,
  );
  useEffect(() => {
    if (likely || !navigator.mediaDevices?.enumerateDevices) return;
    let current = true;
    void navigator.mediaDevices
      .enumerateDevices()
      .then((devices) => {
        if (current && devices.some((device) => device.kind === 'videoinput')) setLikely(true);
      })
      .catch(() => undefined);
    return () => {
      current = false;
    };
  }, [likely]);
  return likely;
}
