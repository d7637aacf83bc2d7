/**
 * The ways a timer's end reaches the person: a sound (WebAudio) and a browser notification.
 * Both are extras to the alarm on screen: a browser may refuse either, and nothing here
 * ever throws because of it.
 */

let audio: AudioContext | null = null;

/**
 * Prepares the sound on a tap or click: browsers let a page play sound only after the person
 * has touched it, so the bench calls this from its buttons.
 */
export function unlockAlarmSound(): void {
  try {
    audio ??= new AudioContext();
    if (audio.state === 'suspended') void audio.resume().catch(() => {});
  } catch (_error) {
    audio = null;
  }
}

/** Three short beeps, when the browser allows sound; silently nothing otherwise. */
export function playAlarmSound(): void {
  try {
    audio ??= new AudioContext();
    if (audio.state === 'suspended') void audio.resume().catch(() => {});
    const start = audio.currentTime + 0.05;
    for (let beep = 0; beep < 3; beep += 1) {
      const oscillator = audio.createOscillator();
      const gain = audio.createGain();
      oscillator.type = 'square';
      oscillator.frequency.value = 880;
      gain.gain.value = 0.15;
      oscillator.connect(gain).connect(audio.destination);
      oscillator.start(start + beep * 0.4);
      oscillator.stop(start + beep * 0.4 + 0.25);
    }
  } catch (_error) {
    // No sound here (no WebAudio, or not allowed): the alarm on screen still shows.
  }
}

export type NotificationState = NotificationPermission | 'unsupported';

export function notificationState(): NotificationState {
  return typeof Notification === 'undefined' ? 'unsupported' : Notification.permission;
}

/** Asks for notifications; call only from a tap or click. */
export async function askForNotifications(): Promise<NotificationState> {
  if (typeof Notification === 'undefined') return 'unsupported';
  try {
    return await Notification.requestPermission();
  } catch (_error) {
    return Notification.permission;
  }
}

/** A browser notification, when allowed; silently nothing otherwise. */
export function notify(title: string, body: string, tag: string): void {
  if (notificationState() !== 'granted') return;
  try {
    new Notification(title, { body, tag });
  } catch (_error) {
    // Some phones show notifications only through a service worker: the screen alarm stays.
  }
}
