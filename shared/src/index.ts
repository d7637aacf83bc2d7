export * from './errors';
export * from './roles';
export * from './list';
export * from './hazards';
export * from './auth';
export * from './users';
export * from './chemicals';
export * from './audit';
