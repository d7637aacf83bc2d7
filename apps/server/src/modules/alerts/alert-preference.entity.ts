import type { AlertDelivery, AlertKind } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';

/** A row of `alert_preferences`: what one person chose; without a row the role's defaults apply. */
export interface AlertPreferenceRow {
  userId: number;
  delivery: AlertDelivery;
  /** The kinds the person gets by e-mail. */
  kinds: AlertKind[];
  updatedAt: string;
  /** Declared so the foreign key is part of the mapping; never loaded. */
  user?: unknown;
}

export const AlertPreferenceEntity = new EntitySchema<AlertPreferenceRow>({
  name: 'AlertPreference',
  tableName: 'alert_preferences',
  columns: {
    userId: { name: 'user_id', type: 'integer', primary: true },
    delivery: { type: 'varchar', length: 10 },
    kinds: { type: 'simple-json' },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
  },
  relations: {
    user: {
      type: 'many-to-one',
      target: 'User',
      joinColumn: { name: 'user_id', foreignKeyConstraintName: 'alert_preferences_user_fk' },
      onDelete: 'CASCADE',
    },
  },
});
