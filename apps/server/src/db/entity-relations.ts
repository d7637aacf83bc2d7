/**
 * A many-to-one relation declared only so its foreign key is part of the mapping (and the
 * schema drift test sees it); never loaded.
 */
export function foreignKey(
  target: string,
  column: string,
  constraintName: string,
  onDelete: 'RESTRICT' | 'SET NULL' | 'CASCADE',
  nullable = false,
) {
  return {
    type: 'many-to-one' as const,
    target,
    joinColumn: { name: column, foreignKeyConstraintName: constraintName },
    onDelete,
    ...(nullable ? { nullable: true } : {}),
  };
}
