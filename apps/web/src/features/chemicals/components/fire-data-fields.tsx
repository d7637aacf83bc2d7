import { useWatch, type Control, type UseFormRegister } from 'react-hook-form';
import {
  fireClassOf,
  ghsFlammableHazardStatements,
  hasLiquidClass,
  liquidClassLabels,
} from '@lotwise/shared';
import { Field } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { toTemperature, type ChemicalFormValues } from './chemical-form-values';

type Name = 'flashPointC' | 'boilingPointC' | 'flashPointSource' | 'boilingPointSource';

/** What the typed figures give, as the person types (the server works it out the same way). */
function Derived({ control }: { control: Control<ChemicalFormValues> }) {
  const [physicalState, flashPointC, boilingPointC] = useWatch({
    control,
    name: ['physicalState', 'flashPointC', 'boilingPointC'],
  });
  const figure = (value: unknown) =>
    typeof value === 'number' && Number.isFinite(value) ? value : null;
  if (!physicalState || !hasLiquidClass(physicalState)) {
    return <>Only liquids and solutions get a liquid class.</>;
  }
  const { liquidClass, ghsFlammableCategory } = fireClassOf({
    physicalState,
    flashPointC: figure(flashPointC),
    boilingPointC: figure(boilingPointC),
  });
  if (!liquidClass)
    return (
      <>No liquid class yet: it needs the flash point (and, below 22.8 °C, the boiling point).</>
    );
  return (
    <>
      Gives {liquidClassLabels[liquidClass]}
      {ghsFlammableCategory
        ? `, GHS category ${ghsFlammableCategory} (${ghsFlammableHazardStatements[ghsFlammableCategory]})`
        : ', not a GHS flammable liquid'}
      .
    </>
  );
}

/**
 * Flash point and boiling point with where each came from. Temperatures are plain text so
 * a minus sign and a decimal comma can be typed on any keyboard.
 */
export function FireDataFields({
  register,
  control,
  hint,
}: {
  register: UseFormRegister<ChemicalFormValues>;
  control: Control<ChemicalFormValues>;
  hint: (name: Name) => { error: string | undefined };
}) {
  return (
    <section
      className="rounded-lg border border-ink-200 bg-white p-4"
      aria-labelledby="fire-form-heading"
    >
      <h2 id="fire-form-heading" className="mb-1 text-base font-semibold">
        Fire data
      </h2>
      <p className="mb-3 text-sm text-ink-600">
        From the SDS (section 9) or a handbook. Lotwise works out the NFPA 30 liquid class and the
        GHS flammable category from them as a reminder; the SDS decides.
      </p>
      <div className="grid gap-4 md:grid-cols-2">
        <Field
          label="Flash point (°C)"
          optional
          {...hint('flashPointC')}
          hint="Closed cup where the source gives both, e.g. −17.8 or 12,8."
          live={<Derived control={control} />}
        >
          {(c) => (
            <Input
              {...c}
              type="text"
              autoComplete="off"
              spellCheck={false}
              className="tabular-nums"
              {...register('flashPointC', { setValueAs: toTemperature })}
            />
          )}
        </Field>
        <Field
          label="Source of the flash point"
          optional
          {...hint('flashPointSource')}
          hint="e.g. NIOSH Pocket Guide, SDS of lot 2291, from memory."
        >
          {(c) => <Input {...c} autoComplete="off" {...register('flashPointSource')} />}
        </Field>
        <Field
          label="Boiling point (°C)"
          optional
          {...hint('boilingPointC')}
          hint="At normal pressure; the initial boiling point of a mixture."
        >
          {(c) => (
            <Input
              {...c}
              type="text"
              autoComplete="off"
              spellCheck={false}
              className="tabular-nums"
              {...register('boilingPointC', { setValueAs: toTemperature })}
            />
          )}
        </Field>
        <Field label="Source of the boiling point" optional {...hint('boilingPointSource')}>
          {(c) => <Input {...c} autoComplete="off" {...register('boilingPointSource')} />}
        </Field>
      </div>
    </section>
  );
}
