/** The search's answer schema, loaded with the first search (see api.ts). */
export { searchResultSchema } from '@lotwise/shared';
