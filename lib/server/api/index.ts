import 'server-only';
// Importing every route module fills the registry; the OpenAPI document and the authorisation tests read it.
export * from './health';
export * from './account';
export * from './labs';
export * from './seed-shapes';
export * from './shape-spaces';
export * from './editions';
export * from './display-profiles';
export * from './packs';
export * from './pack-checks';
export * from './studies';
export * from './participant-sessions';
export * from './api-tokens';
export * from './openapi';
export * from './run-orders';
export * from './study-similarity';
export * from './study-results';
