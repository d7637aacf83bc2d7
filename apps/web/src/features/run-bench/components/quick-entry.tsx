import { useRef, useState, type FormEvent, type ReactNode } from 'react';
import { runPhotoContentTypes, runPhotoMaxBytes } from '@lotwise/shared';
import { Camera, NotebookPen, Thermometer } from 'lucide-react';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { Input, Textarea } from '../../../components/ui/input';
import { parseDecimal } from '../../../lib/numbers';
import { formatFileSize } from '../../../lib/upload';
import { toLocalInputValue } from '../lib/words';

export interface QuickEntryActions {
  reading: (temperatureC: number, at: Date) => Promise<void>;
  note: (text: string) => Promise<void>;
  photo: (file: File, caption: string) => Promise<void>;
}

function ReadingForm({ onAdd }: { onAdd: QuickEntryActions['reading'] }) {
  const [text, setText] = useState('');
  const [editTime, setEditTime] = useState(false);
  const [time, setTime] = useState('');
  const [error, setError] = useState<string>();
  const [timeError, setTimeError] = useState<string>();
  const handleSubmit = async (event: FormEvent) => {
    event.preventDefault();
    const value = parseDecimal(text);
    const at = editTime ? new Date(time) : new Date();
    const badValue =
      value === null || Number.isNaN(value) || value < -200 || value > 1000
        ? 'Type the temperature in °C, e.g. 6.5 (between -200 and 1000).'
        : undefined;
    const badTime =
      editTime && (time === '' || Number.isNaN(at.getTime()))
        ? 'Give the date and time the reading was taken.'
        : undefined;
    setError(badValue);
    setTimeError(badTime);
    if (badValue || badTime) return;
    await onAdd(value!, at);
    setText('');
    setEditTime(false);
  };
  return (
    <form
      onSubmit={handleSubmit}
      noValidate
      aria-label="New reading"
      className="flex flex-col gap-2"
    >
      <div className="flex flex-wrap items-end gap-2">
        <Field label="Temperature (°C)" error={error} className="w-40">
          {(control) => (
            <Input
              {...control}
              inputMode="decimal"
              autoComplete="off"
              value={text}
              onChange={(event) => setText(event.target.value)}
              className="text-lg"
            />
          )}
        </Field>
        <Button
          type="submit"
          variant="primary"
          icon={<Thermometer aria-hidden="true" className="size-4" />}
        >
          Add reading
        </Button>
      </div>
      {editTime ? (
        <Field label="Taken at" error={timeError} className="w-60">
          {(control) => (
            <Input
              {...control}
              type="datetime-local"
              value={time}
              onChange={(event) => setTime(event.target.value)}
            />
          )}
        </Field>
      ) : (
        <p className="text-sm text-ink-600">
          The time is taken when you add it.{' '}
          <button
            type="button"
            className="text-accent-700 underline underline-offset-2 pointer-coarse:py-2"
            onClick={() => {
              setTime(toLocalInputValue(new Date()));
              setEditTime(true);
            }}
          >
            Edit the time
          </button>
        </p>
      )}
    </form>
  );
}

function NoteForm({ onAdd }: { onAdd: QuickEntryActions['note'] }) {
  const [text, setText] = useState('');
  const [error, setError] = useState<string>();
  const handleSubmit = async (event: FormEvent) => {
    event.preventDefault();
    if (!text.trim()) {
      setError('Write the observation first.');
      return;
    }
    setError(undefined);
    await onAdd(text.trim());
    setText('');
  };
  return (
    <form
      onSubmit={handleSubmit}
      noValidate
      aria-label="New observation"
      className="flex flex-col gap-2"
    >
      <Field label="Observation" error={error}>
        {(control) => (
          <Textarea
            {...control}
            rows={2}
            maxLength={2000}
            value={text}
            onChange={(event) => setText(event.target.value)}
          />
        )}
      </Field>
      <Button
        type="submit"
        className="self-start"
        icon={<NotebookPen aria-hidden="true" className="size-4" />}
      >
        Add observation
      </Button>
    </form>
  );
}

function PhotoForm({ onAdd }: { onAdd: QuickEntryActions['photo'] }) {
  const input = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [caption, setCaption] = useState('');
  const [error, setError] = useState<string>();
  const handleSubmit = async (event: FormEvent) => {
    event.preventDefault();
    if (!file) {
      setError('Take or choose a photo first.');
      return;
    }
    if (!(runPhotoContentTypes as readonly string[]).includes(file.type)) {
      setError('Only a JPEG, PNG or WebP photo can be added.');
      return;
    }
    if (file.size > runPhotoMaxBytes) {
      setError(
        `The photo is ${formatFileSize(file.size)}; at most ${formatFileSize(runPhotoMaxBytes)} can be added.`,
      );
      return;
    }
    setError(undefined);
    await onAdd(file, caption.trim());
    setFile(null);
    setCaption('');
    if (input.current) input.current.value = '';
  };
  return (
    <form onSubmit={handleSubmit} noValidate aria-label="New photo" className="flex flex-col gap-2">
      <Field label="Photo" error={error} hint="Opens the camera on a phone or tablet.">
        {(control) => (
          <input
            {...control}
            ref={input}
            type="file"
            accept="image/*"
            capture="environment"
            className="text-sm file:mr-3 file:rounded-md file:border file:border-ink-300 file:bg-white file:px-3 file:py-1.5 file:text-sm file:font-medium pointer-coarse:file:py-2.5"
            onChange={(event) => setFile(event.target.files?.[0] ?? null)}
          />
        )}
      </Field>
      {file && (
        <Field label="Caption" optional>
          {(control) => (
            <Input
              {...control}
              maxLength={2000}
              value={caption}
              onChange={(event) => setCaption(event.target.value)}
            />
          )}
        </Field>
      )}
      <Button
        type="submit"
        className="self-start"
        icon={<Camera aria-hidden="true" className="size-4" />}
      >
        Add photo
      </Button>
    </form>
  );
}

/**
 * Readings, observations and photos, each added to the timeline the moment it is taken;
 * `readingFeedback` says under the reading what became of it (inside its window or not).
 */
export function QuickEntry({
  actions,
  readingFeedback,
}: {
  actions: QuickEntryActions;
  readingFeedback?: ReactNode;
}) {
  return (
    <section
      aria-labelledby="quick-entry-heading"
      className="flex flex-col gap-4 rounded-lg border border-ink-200 bg-white px-4 py-3"
    >
      <h2 id="quick-entry-heading" className="text-base font-semibold">
        Add to the timeline
      </h2>
      <ReadingForm onAdd={actions.reading} />
      <div aria-live="polite">{readingFeedback}</div>
      <div className="grid gap-4 border-t border-ink-100 pt-3 md:grid-cols-2">
        <NoteForm onAdd={actions.note} />
        <PhotoForm onAdd={actions.photo} />
      </div>
    </section>
  );
}
