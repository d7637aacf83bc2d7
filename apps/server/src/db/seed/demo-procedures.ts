import type { ProcedureCreate, ProcedureStepInput } from '@lotwise/shared';

/*
 * The demo procedures' steps, as a teaching handout would give them (invented): what to do,
 * how long, the temperature window with what to do outside it, the line each addition takes
 * (its amount scales with the plan), a caution and the hold points.
 */

/** Aspirin. Lines: 0 salicylic acid, 1 acetic anhydride, 2 phosphoric acid, 3 water. */
export const aspirinSteps: ProcedureStepInput[] = [
  {
    text: 'Weigh the salicylic acid into a dry 50 mL conical flask.',
    lineIndex: 0,
    addition: 'weighed straight into the flask',
  },
  {
    text: 'In the fume hood, add the acetic anhydride, then the phosphoric acid, and swirl to mix.',
    lineIndex: 1,
    addition: 'from a dry measuring cylinder, then the acid drop by drop',
    caution: 'fumeHood',
  },
  {
    text: 'Heat the flask in a water bath at 70–80 °C for 15 min, swirling now and then, until all the solid has dissolved.',
    durationMinutes: 15,
    temperatureLowC: 70,
    temperatureHighC: 80,
    outsideWindow:
      'Above 80 °C: lift the flask out and add cold water to the bath. Below 70 °C: turn the hotplate up a step and wait before timing on.',
    caution: 'fumeHood',
  },
  {
    text: 'Take the flask out of the bath. Still in the hood, add about 2 mL of the ice-cold water to destroy the excess anhydride.',
    addition: 'dropwise, swirling: it fizzes and warms',
    caution: 'exothermicAddition',
  },
  {
    text: 'Add the rest of the ice-cold water and stand the flask in an ice bath until crystals form (about 20 min).',
    durationMinutes: 20,
    temperatureHighC: 10,
    outsideWindow:
      'Above 10 °C: add more ice to the bath. No crystals after 10 min: scratch the inside of the flask with a glass rod.',
    lineIndex: 3,
    addition: 'all at once, then swirl',
    holdPoint: 'a thick crop of crystals has formed and the mixture is below 10 °C',
  },
  {
    text: 'Collect the crystals by suction filtration, wash them with two small portions of ice-cold water and let them dry on the filter paper. Weigh the crude product.',
  },
];

/** Isoamyl acetate. Lines: 0 isoamyl alcohol, 1 acetic acid, 2 sulfuric acid, 3 bicarbonate. */
export const esterSteps: ProcedureStepInput[] = [
  {
    text: 'Measure the isoamyl alcohol into a 50 mL round-bottomed flask with two boiling chips.',
    lineIndex: 0,
    addition: 'from a measuring cylinder',
    caution: 'flammableSolvent',
  },
  {
    text: 'In the fume hood, add the glacial acetic acid and swirl.',
    lineIndex: 1,
    addition: 'from a dry measuring cylinder',
    caution: 'fumeHood',
  },
  {
    text: 'Stand the flask in cold water and add the sulfuric acid, swirling after each drop.',
    temperatureHighC: 40,
    outsideWindow:
      'Stop adding; swirl the flask in the cold water until it is below 35 °C, then go on more slowly.',
    lineIndex: 2,
    addition: 'dropwise over about 2 min',
    caution: 'exothermicAddition',
  },
  {
    text: 'Fit the reflux condenser, turn the cooling water on and clip the joints; only then switch the heating mantle on.',
    holdPoint: 'water flows through the condenser and the joints are clipped',
  },
  {
    text: 'Heat under gentle reflux for 1 h with the mantle (never a flame): the ring of condensate stays in the lower third of the condenser.',
    durationMinutes: 60,
    caution: 'flammableSolvent',
  },
  {
    text: 'Switch the mantle off and let the flask cool to room temperature before taking the condenser off.',
    durationMinutes: 15,
    temperatureHighC: 30,
    outsideWindow: 'Still above 30 °C: lower the mantle away and wait a few more minutes.',
    holdPoint: 'the flask is below 30 °C',
  },
  {
    text: 'Pour the mixture into a separating funnel with 20 mL cold water, shake, run off the lower layer. Wash the ester with the bicarbonate solution, venting the funnel after every shake.',
    lineIndex: 3,
    addition: 'in three portions, venting after each',
    holdPoint: 'the bicarbonate no longer fizzes on shaking',
  },
  {
    text: 'Dry the ester over anhydrous sodium sulfate for 10 min, decant it into a small distillation flask and distil, collecting what comes over at 138–143 °C.',
    temperatureLowC: 138,
    temperatureHighC: 143,
    outsideWindow:
      'Below 138 °C: collect into a separate receiver (forerun). Above 143 °C: stop the distillation.',
    caution: 'flammableSolvent',
  },
];

/** 1 M sodium hydroxide. Lines: 0 sodium hydroxide, 1 water (measured by the flask's mark). */
export const hydroxideSteps: ProcedureStepInput[] = [
  {
    text: 'Put about 150 mL of the water into a 400 mL beaker standing in a bowl of cold water, with a stirrer bar; the rest makes up the volume at the end.',
  },
  {
    text: 'Weigh the sodium hydroxide pellets quickly into a dry, stoppered weighing bottle: they take up water from the air.',
  },
  {
    text: 'Add the pellets to the stirred water, keeping the solution below 40 °C.',
    temperatureHighC: 40,
    outsideWindow:
      'Stop adding; let the solution cool in the water bath to below 35 °C before the next portion.',
    lineIndex: 0,
    addition: 'in about five portions, each dissolved before the next',
    caution: 'exothermicAddition',
  },
  {
    text: 'Let the solution cool to room temperature in the bath (about 20 min) before making it up to the mark.',
    durationMinutes: 20,
    temperatureHighC: 25,
    outsideWindow: 'Still above 25 °C: change the water of the bath and wait.',
    holdPoint: 'the solution is at room temperature (its volume shrinks as it cools)',
  },
  {
    text: 'Pour it into a 250 mL volumetric flask with three rinsings of the beaker, make up to the mark, stopper and invert ten times. Label the bottle with the date and your name.',
  },
];

/**
 * Dibenzalacetone. Lines: 0 benzaldehyde, 1 acetone, 2 sodium hydroxide 1 M, 3 ethanol,
 * 4 water.
 */
export const dibenzalacetoneSteps: ProcedureStepInput[] = [
  {
    text: 'Mix the sodium hydroxide solution and the ethanol in a 100 mL conical flask with a stirrer bar, and stand the flask in a cold water bath on the stirrer.',
    lineIndex: 2,
    addition: 'measured with a cylinder, then the ethanol',
  },
  {
    text: 'Measure the benzaldehyde into a small dry beaker and add the acetone; swirl to mix. No flames on the bench.',
    lineIndex: 1,
    addition: 'into the benzaldehyde',
    caution: 'flammableSolvent',
  },
  {
    text: 'Add the benzaldehyde–acetone mixture to the stirred base, keeping the mixture below 30 °C with the cold water bath.',
    durationMinutes: 20,
    temperatureHighC: 30,
    outsideWindow:
      'Stop the addition, add ice to the water bath and wait until the mixture is below 25 °C; then go on more slowly.',
    lineIndex: 0,
    addition: 'dropwise over about 20 min',
    caution: 'exothermicAddition',
  },
  {
    text: 'Stir for 30 min at room temperature: a yellow solid comes out.',
    durationMinutes: 30,
    temperatureHighC: 30,
    outsideWindow: 'Above 30 °C: add ice to the water bath.',
  },
  {
    text: 'Cool the flask in an ice bath for 10 min.',
    durationMinutes: 10,
    temperatureHighC: 10,
    outsideWindow: 'Above 10 °C: add more ice and stir the bath.',
    holdPoint: 'the mixture is below 10 °C and the solid has settled',
  },
  {
    text: 'Collect the solid by suction filtration and wash it with the cold water until the washings are neutral.',
    lineIndex: 4,
    addition: 'in three or four portions',
    holdPoint: 'the washings test neutral on pH paper',
  },
  {
    text: 'Recrystallise from hot ethanol on a water bath (never a flame), let it cool, then collect and dry the crystals.',
    caution: 'flammableSolvent',
  },
];

/** Chemicals the demo makes in-house and never buys. */
export const preparedOnlyChemicals = new Set(['Sodium hydroxide solution 1 M']);

/**
 * The demo lab's procedures (invented quantities, typical of teaching handouts). The 1 M
 * sodium hydroxide solution made by one is the base of the dibenzalacetone prep: a chain.
 */
export function demoProcedures(id: (name: string) => number): ProcedureCreate[] {
  return [
    {
      title: 'Aspirin from salicylic acid and acetic anhydride',
      reference: 'Lotwise demo handout A1 (invented): acetylation of salicylic acid.',
      baseScale: 'One bench: 2.0 g salicylic acid.',
      expectedYieldPercent: 80,
      // from memory: acetylsalicylic acid melts at about 135–136 °C
      literatureMeltingC: { low: 135, high: 136 },
      cautions:
        'Acetic anhydride is corrosive and its vapour irritates the eyes: dispense it in the fume hood. Adding water to destroy the excess anhydride is exothermic: add it slowly.',
      cautionFlags: { exothermicAddition: true, fumeHood: true },
      lines: [
        {
          chemicalId: id('Salicylic acid'),
          role: 'limiting-reagent',
          quantity: 2.0,
          unit: 'g',
          coefficient: 1,
        },
        {
          chemicalId: id('Acetic anhydride'),
          role: 'reagent',
          quantity: 5.0,
          unit: 'mL',
          coefficient: 1,
        },
        {
          chemicalId: id('Phosphoric acid 85 %'),
          role: 'catalyst',
          quantity: 0.25,
          unit: 'mL',
          notes: 'About 5 drops; 3 drops of sulfuric acid 98 % also work.',
        },
        {
          chemicalId: id('Water, deionised'),
          role: 'work-up',
          quantity: 50,
          unit: 'mL',
          notes: 'Ice-cold, to bring the product down.',
        },
        { chemicalId: id('Acetylsalicylic acid'), role: 'product', coefficient: 1 },
      ],
      steps: aspirinSteps,
    },
    {
      title: 'Isoamyl acetate by Fischer esterification',
      reference: 'Lotwise demo handout E2 (invented): acid-catalysed esterification, reflux 1 h.',
      baseScale: 'One bench: 5.0 mL isoamyl alcohol.',
      expectedYieldPercent: 60,
      cautions:
        'Sulfuric acid 98 % is corrosive: add it dropwise to the cooled mixture. Isoamyl alcohol and the ester are flammable: heat with a mantle, never a flame. The bicarbonate wash gives off carbon dioxide: vent the separating funnel often.',
      cautionFlags: { flammableSolvent: true, exothermicAddition: true, fumeHood: true },
      lines: [
        {
          chemicalId: id('Isoamyl alcohol'),
          role: 'limiting-reagent',
          quantity: 5.0,
          unit: 'mL',
          coefficient: 1,
        },
        {
          chemicalId: id('Acetic acid, glacial'),
          role: 'reagent',
          quantity: 7.0,
          unit: 'mL',
          coefficient: 1,
        },
        { chemicalId: id('Sulfuric acid 98 %'), role: 'catalyst', quantity: 1.0, unit: 'mL' },
        {
          chemicalId: id('Sodium bicarbonate'),
          role: 'work-up',
          quantity: 2.5,
          unit: 'g',
          notes: 'A 5 % wash: 2.5 g dissolved in 50 mL water.',
          dissolvedIn: { chemicalId: id('Water, deionised'), quantity: 50, unit: 'mL' },
        },
        { chemicalId: id('Isoamyl acetate'), role: 'product', coefficient: 1 },
      ],
      steps: esterSteps,
    },
    {
      title: 'Sodium hydroxide solution 1 M',
      reference: 'Lotwise demo handout S1 (invented): 10.0 g in water, made up to 250 mL.',
      baseScale: '250 mL of solution.',
      expectedYieldPercent: 95,
      cautions:
        'Dissolving sodium hydroxide gives out a lot of heat: add the pellets to the water a little at a time, with stirring, in a beaker that stands in cold water. Wear eye protection: the solution is corrosive.',
      cautionFlags: { exothermicAddition: true, keepBelowC: 40 },
      lines: [
        {
          chemicalId: id('Sodium hydroxide'),
          role: 'limiting-reagent',
          quantity: 10.0,
          unit: 'g',
          coefficient: 1,
        },
        {
          chemicalId: id('Water, deionised'),
          role: 'solvent',
          quantity: 250,
          unit: 'mL',
          notes: 'Make up to the mark of a 250 mL volumetric flask.',
        },
        {
          chemicalId: id('Sodium hydroxide solution 1 M'),
          role: 'product',
          coefficient: 1,
          concentration: { molarity: 1 },
        },
      ],
      steps: hydroxideSteps,
    },
    {
      title: 'Dibenzalacetone by aldol condensation',
      reference: 'Lotwise demo handout C3 (invented): Claisen–Schmidt condensation, 2 : 1.',
      baseScale: 'One bench: 0.70 mL acetone.',
      expectedYieldPercent: 75,
      // from memory: the trans,trans isomer melts at about 110–111 °C
      literatureMeltingC: { low: 110, high: 111 },
      cautions:
        'Benzaldehyde and ethanol are combustible: no flames. The base is corrosive. Keep the mixture near room temperature while the benzaldehyde is added.',
      cautionFlags: { flammableSolvent: true, keepBelowC: 30 },
      lines: [
        {
          chemicalId: id('Benzaldehyde'),
          role: 'reagent',
          quantity: 2.0,
          unit: 'mL',
          coefficient: 2,
        },
        {
          chemicalId: id('Acetone'),
          role: 'limiting-reagent',
          quantity: 0.7,
          unit: 'mL',
          coefficient: 1,
        },
        {
          chemicalId: id('Sodium hydroxide solution 1 M'),
          role: 'catalyst',
          quantity: 20,
          unit: 'mL',
          concentration: { molarity: 1 },
          notes: 'Made with the "Sodium hydroxide solution 1 M" procedure.',
        },
        { chemicalId: id('Ethanol'), role: 'solvent', quantity: 15, unit: 'mL' },
        {
          chemicalId: id('Water, deionised'),
          role: 'work-up',
          quantity: 50,
          unit: 'mL',
          notes: 'Cold, to wash the crystals.',
        },
        { chemicalId: id('Dibenzalacetone'), role: 'product', coefficient: 1 },
      ],
      steps: dibenzalacetoneSteps,
    },
  ];
}
