import { useState } from 'react';
import { Plus, Save, Trash2 } from 'lucide-react';
import { watchListCreateSchema, type WatchListEntryInput } from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { Input, Select } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { errorMessage } from '../../../lib/api-client';
import { parseDecimal } from '../../../lib/numbers';
import { useCreateWatchList } from '../api';

interface RowText {
  substance: string;
  casNumber: string;
  threshold: string;
  comparison: 'above' | 'at-or-above';
  action: string;
  source: string;
}

const emptyRow = (): RowText => ({
  substance: '',
  casNumber: '',
  threshold: '',
  comparison: 'above',
  action: '',
  source: '',
});

/** A list of the lab's own regulator: its source and its substances, saved as one list. */
export function OwnListForm() {
  const create = useCreateWatchList();
  const [list, setList] = useState({ jurisdiction: '', name: '', source: '', edition: '' });
  const [rows, setRows] = useState<RowText[]>([emptyRow()]);
  const [problem, setProblem] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);

  function setRow(index: number, changes: Partial<RowText>) {
    setRows((all) => all.map((row, i) => (i === index ? { ...row, ...changes } : row)));
  }

  function submit(event: React.FormEvent) {
    event.preventDefault();
    setSaved(null);
    const entries: WatchListEntryInput[] = rows.map((row) => ({
      substance: row.substance,
      casNumber: row.casNumber,
      thresholdPercent: row.threshold.trim() === '' ? null : (parseDecimal(row.threshold) ?? NaN),
      comparison: row.comparison,
      action: row.action,
      source: row.source,
    }));
    const checked = watchListCreateSchema.safeParse({ ...list, entries });
    if (!checked.success) {
      const issue = checked.error.issues[0]!;
      const where =
        issue.path[0] === 'entries'
          ? `Row ${Number(issue.path[1]) + 1}, ${String(issue.path[2])}`
          : String(issue.path[0]);
      setProblem(`${where}: ${issue.message}`);
      return;
    }
    setProblem(null);
    create.mutate(checked.data, {
      onSuccess: (created) => {
        setSaved(`${created.name} is saved and followed.`);
        setList({ jurisdiction: '', name: '', source: '', edition: '' });
        setRows([emptyRow()]);
      },
    });
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field label="Name of the list">
          {(c) => (
            <Input
              {...c}
              value={list.name}
              onChange={(e) => setList({ ...list, name: e.target.value })}
            />
          )}
        </Field>
        <Field label="Whose rules (jurisdiction)">
          {(c) => (
            <Input
              {...c}
              value={list.jurisdiction}
              onChange={(e) => setList({ ...list, jurisdiction: e.target.value })}
            />
          )}
        </Field>
        <Field label="Regulation" hint="Its title, with the article or annex">
          {(c) => (
            <Input
              {...c}
              value={list.source}
              onChange={(e) => setList({ ...list, source: e.target.value })}
            />
          )}
        </Field>
        <Field label="Edition or date" optional>
          {(c) => (
            <Input
              {...c}
              value={list.edition}
              onChange={(e) => setList({ ...list, edition: e.target.value })}
            />
          )}
        </Field>
      </div>
      <ol className="flex flex-col gap-3">
        {rows.map((row, index) => (
          <li key={index} className="rounded border border-ink-200 px-3 py-2">
            <fieldset className="grid gap-2 sm:grid-cols-3">
              <legend className="text-sm font-semibold text-ink-800">Substance {index + 1}</legend>
              <Field label="Substance">
                {(c) => (
                  <Input
                    {...c}
                    value={row.substance}
                    onChange={(e) => setRow(index, { substance: e.target.value })}
                  />
                )}
              </Field>
              <Field label="CAS RN">
                {(c) => (
                  <Input
                    {...c}
                    value={row.casNumber}
                    onChange={(e) => setRow(index, { casNumber: e.target.value })}
                  />
                )}
              </Field>
              <Field label="Threshold (% w/w)" optional hint="Empty: any concentration">
                {(c) => (
                  <Input
                    {...c}
                    inputMode="decimal"
                    value={row.threshold}
                    onChange={(e) => setRow(index, { threshold: e.target.value })}
                  />
                )}
              </Field>
              <Field label="Applies">
                {(c) => (
                  <Select
                    {...c}
                    value={row.comparison}
                    onChange={(e) =>
                      setRow(index, { comparison: e.target.value as RowText['comparison'] })
                    }
                  >
                    <option value="above">above the threshold</option>
                    <option value="at-or-above">at or above the threshold</option>
                  </Select>
                )}
              </Field>
              <Field label="Action required">
                {(c) => (
                  <Input
                    {...c}
                    value={row.action}
                    onChange={(e) => setRow(index, { action: e.target.value })}
                  />
                )}
              </Field>
              <Field label="Source of the row" hint="e.g. Paragraph 2">
                {(c) => (
                  <Input
                    {...c}
                    value={row.source}
                    onChange={(e) => setRow(index, { source: e.target.value })}
                  />
                )}
              </Field>
            </fieldset>
            {rows.length > 1 && (
              <Button
                variant="ghost"
                size="sm"
                icon={<Trash2 aria-hidden="true" className="size-4" />}
                onClick={() => setRows((all) => all.filter((_, i) => i !== index))}
              >
                Remove substance {index + 1}
              </Button>
            )}
          </li>
        ))}
      </ol>
      {problem && <Notice tone="danger">{problem}</Notice>}
      {create.isError && (
        <Notice tone="danger" title="Not saved">
          {errorMessage(create.error)}
        </Notice>
      )}
      {saved && <Notice tone="ok">{saved}</Notice>}
      <div className="flex flex-wrap gap-2">
        <Button
          icon={<Plus aria-hidden="true" className="size-4" />}
          onClick={() => setRows((all) => [...all, emptyRow()])}
        >
          Add a substance
        </Button>
        <Button
          type="submit"
          variant="primary"
          busy={create.isPending}
          icon={<Save aria-hidden="true" className="size-4" />}
        >
          Save the list
        </Button>
      </div>
    </form>
  );
}
