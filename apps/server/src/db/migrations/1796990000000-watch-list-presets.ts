/**
 * The watch lists Lotwise ships with, inserted by the migration that made the tables. Figures
 * and CAS RNs are `// from memory` of the regulations' published texts (not read from them while
 * writing this file): a lab confirms them against the current consolidated text before relying
 * on them, and may copy a list into its own to correct it.
 */
export interface PresetEntry {
  substance: string;
  casNumber: string;
  thresholdPercent: number | null;
  thresholdBasis: string;
  comparison: 'above' | 'at-or-above';
  action: string;
  source: string;
}

export interface PresetList {
  key: string;
  jurisdiction: string;
  name: string;
  source: string;
  edition: string;
  notes: string;
  entries: PresetEntry[];
}

const euRegulation = 'Regulation (EU) 2019/1148 on the marketing and use of explosives precursors';
const euEdition = 'OJ L 186, 11.7.2019; applies from 1 February 2021';
const restrictedAction =
  'Not to be made available to, introduced by, possessed or used by members of the general public above the limit value (Art. 5; a Member State may license up to the upper limit value); suspicious transactions, significant disappearances and thefts are reported to the national contact point within 24 hours (Art. 9).';
const reportableAction =
  'Suspicious transactions, significant disappearances and thefts are reported to the national contact point within 24 hours (Art. 9).';

function annexI(substance: string, casNumber: string, limit: number, note = ''): PresetEntry {
  return {
    substance,
    casNumber,
    thresholdPercent: limit, // from memory: Annex I, column 2 (limit value)
    thresholdBasis: '% w/w',
    comparison: 'above',
    action: restrictedAction,
    source: `Annex I${note}`,
  };
}

function annexII(substance: string, casNumber: string, powder = false): PresetEntry {
  return {
    substance,
    casNumber,
    // from memory: Annex II lists aluminium and magnesium powders of particle size below
    // 200 µm as substances or in mixtures of 70 % w/w or more of the metal.
    thresholdPercent: powder ? 70 : null,
    thresholdBasis: powder ? '% w/w of the metal, particle size below 200 µm' : '% w/w',
    comparison: 'at-or-above',
    action: reportableAction,
    source: 'Annex II',
  };
}

const deaListIAction =
  'Regulated transactions at or above the 21 CFR 1310.04 thresholds need records, identification of the other party and reports; suspicious orders, unusual losses and disappearances are reported to the DEA (21 CFR 1310.05). Registration applies to handlers of List I chemicals (21 CFR 1309).';
const deaListIIAction =
  'Regulated transactions at or above the 21 CFR 1310.04 thresholds need records and reports; suspicious orders, unusual losses and disappearances are reported to the DEA (21 CFR 1310.05).';

function deaList(list: 'I' | 'II', substance: string, casNumber: string): PresetEntry {
  return {
    substance,
    casNumber,
    thresholdPercent: null,
    thresholdBasis: '% w/w',
    comparison: 'above',
    action: list === 'I' ? deaListIAction : deaListIIAction,
    source: `21 CFR 1310.02(${list === 'I' ? 'a' : 'b'})`,
  };
}

export const watchListPresets: PresetList[] = [
  {
    key: 'eu-2019-1148-annex-i',
    jurisdiction: 'European Union',
    name: 'EU explosives precursors, restricted (Annex I)',
    source: `${euRegulation}, Annex I`,
    edition: euEdition,
    notes:
      'Limit values as % w/w of the substance in a mixture. Member States may set stricter rules. Figures from memory of the published text: confirm with the current consolidated version.',
    entries: [
      annexI('Hydrogen peroxide', '7722-84-1', 12),
      annexI('Nitromethane', '75-52-5', 16),
      annexI('Nitric acid', '7697-37-2', 3),
      annexI('Sulfuric acid', '7664-93-9', 15),
      annexI('Potassium chlorate', '3811-04-9', 40),
      annexI('Potassium perchlorate', '7778-74-7', 40),
      annexI('Sodium chlorate', '7775-09-9', 40),
      annexI('Sodium perchlorate', '7601-89-0', 40),
      {
        substance: 'Ammonium nitrate',
        casNumber: '6484-52-2',
        thresholdPercent: 16, // from memory: Annex I, 16 % by weight of nitrogen
        thresholdBasis: '% nitrogen by weight (of ammonium nitrate)',
        comparison: 'at-or-above',
        action: restrictedAction,
        source: 'Annex I',
      },
    ],
  },
  {
    key: 'eu-2019-1148-annex-ii',
    jurisdiction: 'European Union',
    name: 'EU explosives precursors, reportable (Annex II)',
    source: `${euRegulation}, Annex II`,
    edition: euEdition,
    notes:
      'Reportable at any concentration unless the row says otherwise. Figures from memory of the published text: confirm with the current consolidated version.',
    entries: [
      annexII('Hexamine', '100-97-0'),
      annexII('Acetone', '67-64-1'),
      annexII('Potassium nitrate', '7757-79-1'),
      annexII('Sodium nitrate', '7631-99-4'),
      annexII('Calcium nitrate', '10124-37-5'),
      annexII('Calcium ammonium nitrate', '15245-12-2'),
      annexII('Magnesium powders', '7439-95-4', true),
      annexII('Magnesium nitrate hexahydrate', '13446-18-9'),
      annexII('Aluminium powders', '7429-90-5', true),
    ],
  },
  {
    key: 'us-dea-list-i',
    jurisdiction: 'United States',
    name: 'DEA List I chemicals (examples)',
    source: '21 CFR 1310.02(a)',
    edition: 'eCFR as amended to 2024',
    notes:
      'A selection of the List I chemicals; the regulation lists more, with their salts, optical isomers and salts of optical isomers. Quantity thresholds are in 21 CFR 1310.04. From memory of the published text: confirm with the current eCFR.',
    entries: [
      deaList('I', 'Anthranilic acid', '118-92-3'),
      deaList('I', 'Benzyl cyanide', '140-29-4'),
      deaList('I', 'Ephedrine', '299-42-3'),
      deaList('I', 'Ergonovine', '60-79-7'),
      deaList('I', 'Ergotamine', '113-15-5'),
      deaList('I', 'gamma-Butyrolactone', '96-48-0'),
      deaList('I', 'Hydriodic acid', '10034-85-2'),
      deaList('I', 'Hypophosphorous acid', '6303-21-5'),
      deaList('I', 'Iodine', '7553-56-2'),
      deaList('I', 'Isosafrole', '120-58-1'),
      deaList('I', '3,4-Methylenedioxyphenyl-2-propanone', '4676-39-5'),
      deaList('I', 'Methylamine', '74-89-5'),
      deaList('I', 'N-Acetylanthranilic acid', '89-52-1'),
      deaList('I', 'N-Phenethyl-4-piperidone', '39742-60-4'),
      deaList('I', 'Nitroethane', '79-24-3'),
      deaList('I', 'Phenylacetic acid', '103-82-2'),
      deaList('I', 'Phenylpropanolamine', '14838-15-4'),
      deaList('I', 'Piperonal', '120-57-0'),
      deaList('I', 'Pseudoephedrine', '90-82-4'),
      deaList('I', 'Red phosphorus', '7723-14-0'),
      deaList('I', 'Safrole', '94-59-7'),
    ],
  },
  {
    key: 'us-dea-list-ii',
    jurisdiction: 'United States',
    name: 'DEA List II chemicals',
    source: '21 CFR 1310.02(b)',
    edition: 'eCFR as amended to 2024',
    notes:
      'Quantity thresholds are in 21 CFR 1310.04. From memory of the published text: confirm with the current eCFR.',
    entries: [
      deaList('II', 'Acetic anhydride', '108-24-7'),
      deaList('II', 'Acetone', '67-64-1'),
      deaList('II', 'Benzyl chloride', '100-44-7'),
      deaList('II', 'Ethyl ether', '60-29-7'),
      deaList('II', 'Hydrochloric acid (including anhydrous hydrogen chloride)', '7647-01-0'),
      deaList('II', 'Methyl ethyl ketone', '78-93-3'),
      deaList('II', 'Methyl isobutyl ketone', '108-10-1'),
      deaList('II', 'Potassium permanganate', '7722-64-7'),
      deaList('II', 'Sulfuric acid', '7664-93-9'),
      deaList('II', 'Toluene', '108-88-3'),
    ],
  },
];
