/** Reads QR codes from the frames of a playing video. */
export interface QrDecoder {
  /** `native`: the browser's BarcodeDetector; `library`: jsQR, loaded on first use. */
  kind: 'native' | 'library';
  /** The text of a QR code in the video's current frame, or null when none is read. */
  decode(video: HTMLVideoElement): Promise<string | null>;
}

interface DetectedBarcode {
  rawValue: string;
}
interface BarcodeDetectorLike {
  detect(source: HTMLVideoElement): Promise<DetectedBarcode[]>;
}
interface BarcodeDetectorClass {
  new (options: { formats: string[] }): BarcodeDetectorLike;
  getSupportedFormats?: () => Promise<string[]>;
}

/** Frames are scaled down to this width before jsQR reads them: enough for a label at arm's length. */
const libraryFrameWidth = 640;

async function nativeDecoder(): Promise<QrDecoder | null> {
  const Detector = (globalThis as { BarcodeDetector?: BarcodeDetectorClass }).BarcodeDetector;
  if (!Detector) return null;
  try {
    const formats = (await Detector.getSupportedFormats?.()) ?? [];
    if (!formats.includes('qr_code')) return null;
    const detector = new Detector({ formats: ['qr_code'] });
    return {
      kind: 'native',
      decode: async (video) => (await detector.detect(video))[0]?.rawValue ?? null,
    };
  } catch (_error) {
    return null;
  }
}

async function libraryDecoder(): Promise<QrDecoder> {
  // Loaded only when a camera view opens, so it stays out of the main bundle.
  const { default: jsQR } = await import('jsqr');
  const canvas = document.createElement('canvas');
  const context = canvas.getContext('2d', { willReadFrequently: true });
  return {
    kind: 'library',
    decode: (video) => {
      if (!context || video.videoWidth === 0) return Promise.resolve(null);
      const scale = Math.min(1, libraryFrameWidth / video.videoWidth);
      canvas.width = Math.round(video.videoWidth * scale);
      canvas.height = Math.round(video.videoHeight * scale);
      context.drawImage(video, 0, 0, canvas.width, canvas.height);
      const frame = context.getImageData(0, 0, canvas.width, canvas.height);
      const found = jsQR(frame.data, frame.width, frame.height, {
        inversionAttempts: 'dontInvert',
      });
      return Promise.resolve(found?.data ?? null);
    },
  };
}

/** The browser's own QR reader when it has one, else the jsQR library. */
export async function createQrDecoder(): Promise<QrDecoder> {
  return (await nativeDecoder()) ?? libraryDecoder();
}
