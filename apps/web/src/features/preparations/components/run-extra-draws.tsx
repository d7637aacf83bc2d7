import { Plus } from 'lucide-react';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { ContainerDraw, newDraw } from './container-draw';
import { LineChemicalPicker } from './line-chemical-picker';
import { Section } from './page-parts';
import { formKey, type ExtraDraw } from './run-record-body';

/** "Extra draws": anything used that is not a line of the procedure. */
export function RunExtraDraws({
  extras,
  setExtras,
}: {
  extras: ExtraDraw[];
  setExtras: (update: (all: ExtraDraw[]) => ExtraDraw[]) => void;
}) {
  return (
    <Section id="extra-heading" title="Extra draws">
      <p className="text-sm text-ink-600">
        Anything used that is not a line of the procedure, e.g. solvent to recrystallize from.
      </p>
      {extras.map((extra, index) => (
        <div
          key={extra.key}
          className="flex flex-col gap-2 rounded-lg border border-ink-200 bg-white px-4 py-3"
        >
          <div className="grid gap-3 md:grid-cols-2">
            <Field label={`Extra draw ${index + 1}: chemical`}>
              {(props) => (
                <LineChemicalPicker
                  id={props.id}
                  label={`extra draw ${index + 1}`}
                  value={extra.chemical}
                  onChange={(chemical) =>
                    setExtras((all) =>
                      all.map((e) =>
                        e.key === extra.key
                          ? { ...e, chemical, draw: newDraw('', chemical?.stockUnit ?? 'mL') }
                          : e,
                      ),
                    )
                  }
                />
              )}
            </Field>
            <Field label="What for">
              {(props) => (
                <Input
                  {...props}
                  value={extra.purpose}
                  onChange={(event) =>
                    setExtras((all) =>
                      all.map((e) =>
                        e.key === extra.key ? { ...e, purpose: event.target.value } : e,
                      ),
                    )
                  }
                />
              )}
            </Field>
          </div>
          {extra.chemical && (
            <ContainerDraw
              chemicalId={extra.chemical.id}
              value={extra.draw}
              label={`Extra draw ${index + 1}`}
              onChange={(draw) =>
                setExtras((all) => all.map((e) => (e.key === extra.key ? { ...e, draw } : e)))
              }
              onRemove={() => setExtras((all) => all.filter((e) => e.key !== extra.key))}
            />
          )}
        </div>
      ))}
      <Button
        size="sm"
        className="self-start"
        icon={<Plus aria-hidden="true" className="size-4" />}
        onClick={() =>
          setExtras((all) => [
            ...all,
            {
              key: formKey('extra'),
              chemical: null,
              purpose: 'recrystallization solvent',
              draw: newDraw('', 'mL'),
            },
          ])
        }
      >
        Add an extra draw
      </Button>
    </Section>
  );
}
