import { useId, useState } from 'react';
import { Check, Copy } from 'lucide-react';
import { Button } from '../../../components/ui/button';
import { Input } from '../../../components/ui/input';

/** Turns a link the server gives (absolute or a path) into one a person can paste anywhere. */
export function absoluteUrl(url: string): string {
  try {
    return new URL(url, window.location.origin).toString();
  } catch (_error) {
    return url;
  }
}

/** The invitation link with a copy button; Lotwise shows it, the admin passes it on. */
export function InviteLink({ url, name }: { url: string; name: string }) {
  const id = useId();
  const [copied, setCopied] = useState(false);
  const full = absoluteUrl(url);

  async function handleCopy() {
    try {
      await navigator.clipboard.writeText(full);
      setCopied(true);
    } catch (_error) {
      // Some browsers refuse the clipboard on plain http; the field stays selectable.
      document.getElementById(id)?.focus();
    }
  }

  return (
    <div className="flex flex-col gap-2">
      <label htmlFor={id} className="text-sm text-ink-800">
        Send this link to {name}. It lets them choose a password once; anyone with the link can use
        it, so pass it on privately.
      </label>
      <div className="flex gap-2">
        <Input
          id={id}
          readOnly
          value={full}
          onFocus={(event) => event.currentTarget.select()}
          className="font-mono text-xs"
        />
        <Button
          onClick={() => void handleCopy()}
          icon={
            copied ? (
              <Check aria-hidden="true" className="size-4" />
            ) : (
              <Copy aria-hidden="true" className="size-4" />
            )
          }
        >
          {copied ? 'Copied' : 'Copy'}
        </Button>
      </div>
    </div>
  );
}
