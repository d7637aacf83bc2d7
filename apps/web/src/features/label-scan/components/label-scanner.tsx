import { useCallback, useEffect, useRef, useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router';
import { Camera, CameraOff, LoaderCircle, ScanLine } from 'lucide-react';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { isApiError } from '../../../lib/api-client';
import { readScannedLabel } from '../../../lib/label-scan';
import { createQrDecoder, type QrDecoder } from '../../../lib/qr-decoder';
import { usePublicSettings } from '../../../lib/public-settings';
import { paths } from '../../../config/paths';
import { fetchContainerByLabel } from '../api';
import { useCamera, type CameraState } from '../use-camera';

/** How often a frame is read, in ms: quick enough to feel instant, light on a phone's battery. */
const frameInterval = 150;
/** The same code read again within this time is not looked up again (ms). */
const repeatPause = 3000;

type Finding =
  | { kind: 'looking'; code: string }
  | { kind: 'found'; code: string; chemicalName: string }
  | { kind: 'not-found'; code: string }
  | { kind: 'other-lab'; code: string; origin: string }
  | { kind: 'unknown'; text: string }
  | { kind: 'failed'; code: string };

const cameraWords: Record<Exclude<CameraState, 'scanning'>, { title: string; text: string }> = {
  asking: {
    title: 'Asking for the camera…',
    text: 'Allow Lotwise to use the camera when your browser asks.',
  },
  denied: {
    title: 'The camera is blocked for Lotwise',
    text: 'To allow it, open the site settings (the icon beside the address bar), set Camera to Allow, then press Try again. Or type the code printed under the QR code below.',
  },
  'no-camera': {
    title: 'No camera found',
    text: 'This device has no camera Lotwise can use. Type the code printed under the QR code below.',
  },
  insecure: {
    title: 'The camera needs a secure address',
    text: 'Browsers offer the camera only to pages opened over HTTPS. Ask whoever runs Lotwise for its https:// address, or type the code below.',
  },
  busy: {
    title: 'The camera is in use',
    text: 'Another app or tab is using the camera. Close it, then press Try again, or type the code below.',
  },
  failed: {
    title: 'The camera could not be started',
    text: 'Press Try again, or type the code printed under the QR code below.',
  },
};

function findingText(finding: Finding): { tone: 'info' | 'ok' | 'warn'; text: string } {
  switch (finding.kind) {
    case 'looking':
      return { tone: 'info', text: `Read ${finding.code}. Looking it up…` };
    case 'found':
      return {
        tone: 'ok',
        text: `Found ${finding.code}: ${finding.chemicalName}. Opening it to record a draw…`,
      };
    case 'not-found':
      return {
        tone: 'warn',
        text: `No container in this lab has the label ${finding.code}. Still scanning: hold up another label.`,
      };
    case 'other-lab':
      return {
        tone: 'warn',
        text: `This label belongs to another lab (${finding.origin}); its container is not in this lab’s stock. Still scanning.`,
      };
    case 'unknown':
      return {
        tone: 'warn',
        text: `This QR code is not a Lotwise label (it reads “${finding.text.length > 60 ? `${finding.text.slice(0, 60)}…` : finding.text}”). Still scanning.`,
      };
    case 'failed':
      return {
        tone: 'warn',
        text: `${finding.code} could not be looked up just now (no connection?). Still scanning.`,
      };
  }
}

/**
 * The camera view of "Scan a label": reads a container's QR label (or a typed code) and opens
 * that container ready to record a draw. `onDone` closes the view; unmounting stops the camera.
 */
export function LabelScanner({ onDone }: { onDone: () => void }) {
  const navigate = useNavigate();
  const settings = usePublicSettings();
  const videoRef = useRef<HTMLVideoElement>(null);
  const [attempt, setAttempt] = useState(0);
  const camera = useCamera(videoRef, attempt);
  const [decoder, setDecoder] = useState<QrDecoder | null>(null);
  const [finding, setFinding] = useState<Finding | null>(null);
  const [typed, setTyped] = useState('');
  const lastRead = useRef<{ text: string; at: number } | null>(null);
  const busy = useRef(false);

  const labOrigins = [window.location.origin, ...(settings.data ? [settings.data.publicUrl] : [])];
  const originsKey = labOrigins.join(' ');

  const handleText = useCallback(
    async (text: string) => {
      const read = readScannedLabel(text, originsKey.split(' '));
      if (read.kind === 'unknown') return setFinding({ kind: 'unknown', text: read.text });
      if (read.kind === 'other-lab') return setFinding(read);
      setFinding({ kind: 'looking', code: read.code });
      try {
        const container = await fetchContainerByLabel(read.code);
        setFinding({
          kind: 'found',
          code: container.labelCode,
          chemicalName: container.chemical.name,
        });
        onDone();
        navigate(`${paths.stockContainer(container.id)}#draw`);
      } catch (error) {
        const missing = isApiError(error) && (error.status === 404 || error.status === 400);
        setFinding({ kind: missing ? 'not-found' : 'failed', code: read.code });
      }
    },
    [navigate, onDone, originsKey],
  );

  useEffect(() => {
    if (camera !== 'scanning') return;
    let current = true;
    void createQrDecoder().then((made) => {
      if (current) setDecoder(made);
    });
    return () => {
      current = false;
    };
  }, [camera]);

  useEffect(() => {
    if (camera !== 'scanning' || !decoder) return;
    const timer = window.setInterval(() => {
      const video = videoRef.current;
      if (busy.current || !video || video.readyState < 2) return;
      busy.current = true;
      decoder
        .decode(video)
        .then(async (text) => {
          if (!text) return;
          const now = Date.now();
          const last = lastRead.current;
          if (last && last.text === text && now - last.at < repeatPause) return;
          lastRead.current = { text, at: now };
          await handleText(text);
        })
        .catch(() => undefined)
        .finally(() => {
          busy.current = false;
        });
    }, frameInterval);
    return () => window.clearInterval(timer);
  }, [camera, decoder, handleText]);

  function handleTyped(event: FormEvent) {
    event.preventDefault();
    if (typed.trim()) void handleText(typed);
  }

  const words = camera === 'scanning' ? null : cameraWords[camera];
  const said = finding ? findingText(finding) : null;

  return (
    <div
      className="flex flex-col gap-4"
      data-testid="label-scanner"
      data-camera={camera}
      data-decoder={decoder?.kind ?? ''}
    >
      <div className="relative aspect-[4/3] w-full overflow-hidden rounded-md bg-ink-900">
        <video
          ref={videoRef}
          muted
          playsInline
          aria-label="Camera view"
          className={camera === 'scanning' ? 'size-full object-cover' : 'hidden'}
        />
        {camera === 'scanning' ? (
          <div
            aria-hidden="true"
            className="pointer-events-none absolute inset-[12%] rounded-lg border-2 border-white/80 shadow-[0_0_0_999px_rgba(0,0,0,0.25)]"
          />
        ) : (
          <div
            aria-hidden="true"
            className="absolute inset-0 flex flex-col items-center justify-center gap-2 p-4 text-center text-white"
          >
            {camera === 'asking' ? (
              <LoaderCircle aria-hidden="true" className="size-8 animate-spin" />
            ) : (
              <CameraOff aria-hidden="true" className="size-8" />
            )}
            <p className="text-sm font-semibold">{words?.title}</p>
          </div>
        )}
      </div>

      <div aria-live="polite" className="flex flex-col gap-2">
        {camera === 'scanning' ? (
          <p className="flex items-start gap-2 text-sm text-ink-800">
            <ScanLine aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-accent-700" />
            Scanning. Hold the label’s QR code inside the frame, about a hand’s width away.
          </p>
        ) : (
          words && (
            <Notice tone={camera === 'asking' ? 'info' : 'warn'} title={words.title}>
              {words.text}
            </Notice>
          )
        )}
        {said && <Notice tone={said.tone}>{said.text}</Notice>}
      </div>

      {camera !== 'scanning' && camera !== 'asking' && camera !== 'insecure' && (
        <div>
          <Button
            variant="secondary"
            icon={<Camera aria-hidden="true" className="size-4" />}
            onClick={() => setAttempt((n) => n + 1)}
          >
            Try again
          </Button>
        </div>
      )}

      <form onSubmit={handleTyped} className="flex items-end gap-2" aria-label="Type a label code">
        <Field label="Or type the code on the label" className="flex-1">
          {(control) => (
            <Input
              {...control}
              value={typed}
              onChange={(event) => setTyped(event.target.value)}
              placeholder="LW-00042"
              autoComplete="off"
              autoCapitalize="characters"
              spellCheck={false}
            />
          )}
        </Field>
        <Button type="submit" variant="primary">
          Open
        </Button>
      </form>
    </div>
  );
}
