import { useState } from 'react';
import {
  alertKindLabels,
  alertKinds,
  type AlertDelivery,
  type AlertKind,
  type AlertPreferences,
} from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { ErrorState } from '../../../components/ui/error-state';
import { Checkbox } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-client';
import { useAlertPreferences, useSaveAlertPreferences } from '../api';

/** Alert e-mail settings of the signed-in person: immediate or daily digest, and which kinds. */
export function AlertPreferencesPage() {
  const preferences = useAlertPreferences();
  if (preferences.isPending) return <PageSpinner label="Loading your alert settings…" />;
  if (preferences.isError) {
    return <ErrorState error={preferences.error} onRetry={() => void preferences.refetch()} />;
  }
  return <PreferencesForm saved={preferences.data} />;
}

function PreferencesForm({ saved }: { saved: AlertPreferences }) {
  const save = useSaveAlertPreferences();
  const [delivery, setDelivery] = useState<AlertDelivery>(saved.delivery);
  const [kinds, setKinds] = useState<AlertKind[]>(saved.kinds);
  const { scope, digestHour, isDefault } = saved;

  const toggle = (kind: AlertKind, on: boolean) =>
    setKinds((current) => (on ? [...current, kind] : current.filter((k) => k !== kind)));

  return (
    <form
      className="flex max-w-2xl flex-col gap-5"
      onSubmit={(event) => {
        event.preventDefault();
        save.mutate({ delivery, kinds });
      }}
    >
      <div>
        <h1 className="text-xl font-semibold text-ink-900">Alert e-mails</h1>
        <p className="text-sm text-ink-600">
          {scope === 'all'
            ? 'You hear about every chemical in the lab.'
            : 'You hear about chemicals you have used or claimed in a shared order.'}{' '}
          {isDefault && 'These are the defaults of your role until you save a choice.'}
        </p>
      </div>

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 font-medium text-ink-900">When</legend>
        <label className="flex items-center gap-2 text-sm">
          <input
            type="radio"
            name="delivery"
            checked={delivery === 'immediate'}
            onChange={() => setDelivery('immediate')}
          />
          As it happens
        </label>
        <label className="flex items-center gap-2 text-sm">
          <input
            type="radio"
            name="delivery"
            checked={delivery === 'digest'}
            onChange={() => setDelivery('digest')}
          />
          One daily digest at {String(digestHour).padStart(2, '0')}:00
        </label>
      </fieldset>

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 font-medium text-ink-900">About</legend>
        {alertKinds.map((kind) => (
          <label key={kind} className="flex items-center gap-2 text-sm">
            <Checkbox
              checked={kinds.includes(kind)}
              onChange={(event) => toggle(kind, event.target.checked)}
            />
            {alertKindLabels[kind]}
          </label>
        ))}
      </fieldset>

      {save.isSuccess && <Notice tone="ok">Saved.</Notice>}
      {save.isError && <Notice tone="danger">{errorMessage(save.error)}</Notice>}
      <div>
        <Button type="submit" variant="primary" busy={save.isPending}>
          Save
        </Button>
      </div>
    </form>
  );
}
