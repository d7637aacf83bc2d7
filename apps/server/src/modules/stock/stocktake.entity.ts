import { EntitySchema } from 'typeorm';

export interface StocktakeSummary {
  expected: number;
  confirmed: number;
  corrected: number;
  missing: number;
  notCounted: number;
}

/** A row of `stocktakes`: who counted which place when, and what they found. */
export interface StocktakeRow {
  id: number;
  locationId: number;
  includeSublocations: boolean;
  userId: number | null;
  note: string;
  summary: StocktakeSummary;
  createdAt: string;
  /** Declared so the foreign keys are part of the mapping; never loaded. */
  location?: unknown;
  user?: unknown;
}

export const StocktakeEntity = new EntitySchema<StocktakeRow>({
  name: 'Stocktake',
  tableName: 'stocktakes',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    locationId: { name: 'location_id', type: 'integer' },
    includeSublocations: { name: 'include_sublocations', type: 'boolean' },
    userId: { name: 'user_id', type: 'integer', nullable: true },
    note: { type: 'text' },
    summary: { type: 'simple-json' },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
  },
  relations: {
    location: {
      type: 'many-to-one',
      target: 'Location',
      joinColumn: { name: 'location_id', foreignKeyConstraintName: 'stocktakes_location_fk' },
      onDelete: 'RESTRICT',
    },
    user: {
      type: 'many-to-one',
      target: 'User',
      joinColumn: { name: 'user_id', foreignKeyConstraintName: 'stocktakes_user_fk' },
      onDelete: 'SET NULL',
      nullable: true,
    },
  },
  indices: [{ name: 'stocktakes_location_idx', columns: ['locationId'] }],
});
