/**
 * Where the lab-area totals read a chemical's flash point and boiling point (°C): SQL
 * expressions over the chemicals table aliased `ch`. The one place to change if the columns move.
 */
export const flashPointColumn = 'NULL';
export const boilingPointColumn = 'NULL';
