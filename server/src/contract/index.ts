/**
 * The contract: what the browser and the server agree on, in one pure module both import
 * (alias `@contract`). No I/O, no clock; it imports only zod and `@calc`. Lint lets the client import
 * this folder of the server and nothing else.
 */
export * from './enums';
export * from './permissions';
export * from './fields';
export * from './list-query';
export * from './address-fields';
export * from './design-conditions';
export * from './accounts';
export * from './records';
export * from './records-office';
export * from './desk';
export * from './api-version';
export * from './links';
export * from './device';
export * from './proposal';
export * from './cooling-off-notice';
export * from './dates';
export * from './proposal-diff';
export * from './payments';
export * from './loss-reasons';
export * from './proposal-link';
export * from './after-signing';
export * from './proposal-details';
export * from './signing';
export * from './commissioning';
export * from './reports';
export * from './install';
