/**
 * @lotwise/chem: the chemistry and arithmetic of Lotwise. Pure functions, no I/O; errors
 * are {@link ChemError}s with stable codes and messages a person can act on.
 */
export * from './errors';
export * from './elements';
export * from './formula';
export * from './molar-mass';
export * from './units';
export * from './conversions';
export * from './solutions';
export * from './stoichiometry';
export * from './scaling';
export * from './cas';
export * from './money';
export * from './consumption';
export * from './segregation';
export * from './peroxide';
export * from './stock';
export * from './weighing';
export * from './reorder';
export * from './packs';
export * from './timeline';
export * from './flammability';
export * from './flammable-limits';
