/** `lib/api` — request and answer shapes of the calculation API (v1), its limits and its OpenAPI document. */
export * from './limits';
export * from './schemas';
export * from './responses';
export { buildOpenApiDocument } from './openapi';
export { WIRE_SIGNIFICANT_DIGITS, roundForWire, toDotPath, toWire } from './finite';
export { EXAMPLE_AMPACITY_REQUEST, EXAMPLE_BURIED_GROUP_REQUEST, EXAMPLE_BUSBAR_SYSTEM_REQUEST, EXAMPLE_EVALUATE_REQUEST } from './examples';
