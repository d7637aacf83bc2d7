import { GHS_FLAMMABLE_CATEGORIES, LIQUID_CLASSES, type LiquidClass } from '@lotwise/chem';
import { z } from 'zod';

/**
 * The words of the room rules that several capabilities share: liquid classes, lab-unit
 * classes, flammable-storage places, container materials and waste characteristics. Each
 * capability's request and response schemas live in its own file.
 */

export const liquidClassSchema = z.enum(LIQUID_CLASSES, {
  message: `must be one of: ${LIQUID_CLASSES.join(', ')}`,
});

export const liquidClassLabels: Record<LiquidClass, string> = {
  IA: 'Class IA flammable liquid',
  IB: 'Class IB flammable liquid',
  IC: 'Class IC flammable liquid',
  II: 'Class II combustible liquid',
  IIIA: 'Class IIIA combustible liquid',
  IIIB: 'Class IIIB combustible liquid',
};

export const ghsFlammableCategorySchema = z.union(
  GHS_FLAMMABLE_CATEGORIES.map((c) => z.literal(c)) as [
    z.ZodLiteral<1>,
    z.ZodLiteral<2>,
    z.ZodLiteral<3>,
    z.ZodLiteral<4>,
  ],
);

/** NFPA 45 fire-hazard classes of a laboratory unit (A is the most liquid allowed). */
export const labUnitClasses = ['A', 'B', 'C', 'D'] as const;
export type LabUnitClass = (typeof labUnitClasses)[number];
export const labUnitClassSchema = z.enum(labUnitClasses, {
  message: `must be one of: ${labUnitClasses.join(', ')}`,
});

/** What a marked place is, for the room rules. */
export const labAreaKinds = ['lab-unit', 'control-area'] as const;
export type LabAreaKind = (typeof labAreaKinds)[number];
export const labAreaKindSchema = z.enum(labAreaKinds, {
  message: `must be one of: ${labAreaKinds.join(', ')}`,
});

export const floorAreaUnits = ['m2', 'ft2'] as const;
export type FloorAreaUnit = (typeof floorAreaUnits)[number];
export const floorAreaUnitSchema = z.enum(floorAreaUnits, { message: 'must be m2 or ft2' });

/** A place approved for flammable liquids: quantities there count under the higher figures. */
export const flammableStorageKinds = ['cabinet', 'safety-can'] as const;
export type FlammableStorageKind = (typeof flammableStorageKinds)[number];
export const flammableStorageKindSchema = z.enum(flammableStorageKinds, {
  message: `must be one of: ${flammableStorageKinds.join(', ')}`,
});
export const flammableStorageLabels: Record<FlammableStorageKind, string> = {
  cabinet: 'Approved flammable-storage cabinet',
  'safety-can': 'Approved safety cans',
};

/** What a container is made of, for the container-size limits. */
export const containerMaterials = ['glass', 'metal', 'approved-plastic', 'safety-can'] as const;
export type ContainerMaterial = (typeof containerMaterials)[number];
export const containerMaterialSchema = z.enum(containerMaterials, {
  message: `must be one of: ${containerMaterials.join(', ')}`,
});
export const containerMaterialLabels: Record<ContainerMaterial, string> = {
  glass: 'Glass',
  metal: 'Metal',
  'approved-plastic': 'Approved plastic',
  'safety-can': 'Safety can',
};

/** Hazard characteristics of a waste (US EPA 40 CFR 261 Subpart C names them this way). */
export const wasteCharacteristics = ['ignitable', 'corrosive', 'reactive', 'toxic'] as const;
export type WasteCharacteristic = (typeof wasteCharacteristics)[number];
export const wasteCharacteristicSchema = z.enum(wasteCharacteristics, {
  message: `must be one of: ${wasteCharacteristics.join(', ')}`,
});

/** The reminder every room-rule answer and page carries. */
export const roomRulesReminder =
  'Lotwise works these figures out as a reminder, not an approval. The authority having jurisdiction, local regulations, the edition of the code they adopted and the SDS decide.';
