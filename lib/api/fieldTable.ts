/**
 * Flattens the generated JSON Schemas of the request bodies into rows for the documentation page
 * (path, type, allowed values, required, meaning), so that the page can never disagree with the
 * validation.
 */
import { buildOpenApiDocument } from './openapi';

export interface FieldRow {
  path: string;
  type: string;
  allowed: string;
  required: boolean;
  description: string;
}

type Schema = {
  type?: string;
  properties?: Record<string, Schema>;
  required?: string[];
  items?: Schema;
  anyOf?: Schema[];
  oneOf?: Schema[];
  enum?: unknown[];
  const?: unknown;
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  minItems?: number;
  maxItems?: number;
  maxLength?: number;
  pattern?: string;
  description?: string;
  $ref?: string;
};

function resolve(schema: Schema, components: Record<string, Schema>): Schema {
  return schema.$ref ? (components[schema.$ref.replace('#/components/schemas/', '')] ?? schema) : schema;
}

function describeNumber(schema: Schema): string {
  const low = schema.exclusiveMinimum !== undefined ? `> ${schema.exclusiveMinimum}` : schema.minimum !== undefined ? `≥ ${schema.minimum}` : '';
  const high = schema.exclusiveMaximum !== undefined ? `< ${schema.exclusiveMaximum}` : schema.maximum !== undefined ? `≤ ${schema.maximum}` : '';
  return [low, high].filter(Boolean).join(' and ');
}

function typeAndAllowed(schema: Schema): { type: string; allowed: string } {
  if (schema.const !== undefined) return { type: typeof schema.const, allowed: JSON.stringify(schema.const) };
  if (schema.enum) return { type: 'string', allowed: schema.enum.map((v) => JSON.stringify(v)).join(', ') };
  const alternatives = schema.anyOf ?? schema.oneOf;
  if (alternatives && alternatives.every((a) => a.const !== undefined)) {
    return { type: typeof alternatives[0].const, allowed: alternatives.map((a) => JSON.stringify(a.const)).join(' or ') };
  }
  if (alternatives) {
    const parts = alternatives.map(typeAndAllowed);
    return { type: parts.map((p) => p.type).join(' or '), allowed: parts.map((p) => p.allowed).filter(Boolean).join('; ') };
  }
  if (schema.type === 'number') return { type: 'number', allowed: describeNumber(schema) };
  if (schema.type === 'integer') return { type: 'integer', allowed: describeNumber(schema) };
  if (schema.type === 'string') return { type: 'string', allowed: schema.maxLength !== undefined ? `up to ${schema.maxLength} characters` : schema.pattern ? 'decimal text' : '' };
  if (schema.type === 'array') {
    const count = [schema.minItems !== undefined ? `at least ${schema.minItems}` : '', schema.maxItems !== undefined ? `at most ${schema.maxItems}` : ''].filter(Boolean).join(', ');
    return { type: 'list', allowed: count };
  }
  return { type: schema.type ?? 'value', allowed: '' };
}

/** Rows for every field of an object schema at `path`, nested objects and list items included. */
function walkRows(root: Schema, prefix: string, components: Record<string, Schema>): FieldRow[] {
  const rows: FieldRow[] = [];
  const walk = (raw: Schema, path: string, parentRequired: boolean) => {
    const schema = resolve(raw, components);
    for (const [name, propertyRaw] of Object.entries(schema.properties ?? {})) {
      const property = resolve(propertyRaw, components);
      const fieldPath = path ? `${path}.${name}` : name;
      const required = parentRequired && (schema.required ?? []).includes(name);
      const { type, allowed } = typeAndAllowed(property);
      const isObject = property.type === 'object' && property.properties;
      const itemObject = property.type === 'array' && property.items && resolve(property.items, components).type === 'object';
      if (propertyRaw.$ref && (property.oneOf || property.anyOf)) {
        rows.push({ path: fieldPath, type: 'object', allowed: 'one of the kinds below', required, description: property.description ?? propertyRaw.description ?? '' });
        continue;
      }
      rows.push({ path: fieldPath, type: isObject ? 'object' : itemObject ? 'list of objects' : type, allowed, required, description: propertyRaw.description ?? property.description ?? '' });
      if (isObject) walk(property, fieldPath, required);
      if (itemObject) walk(resolve(property.items!, components), `${fieldPath}[]`, true);
    }
  };
  walk(root, prefix, true);
  return rows;
}

/** Rows for every field of an object schema, nested objects and list items included. */
export function fieldRows(schemaId: string, prefix = ''): FieldRow[] {
  const document = buildOpenApiDocument() as { components: { schemas: Record<string, Schema> } };
  const components = document.components.schemas;
  return walkRows(components[schemaId], prefix, components);
}

/** The alternatives of a `oneOf` schema (installation kinds), each with its own rows (nested objects and lists included). */
export function variantRows(schemaId: string, prefix: string): { kind: string; rows: FieldRow[] }[] {
  const document = buildOpenApiDocument() as { components: { schemas: Record<string, Schema> } };
  const components = document.components.schemas;
  const variants = components[schemaId]?.oneOf ?? components[schemaId]?.anyOf ?? [];
  return variants.map((variant) => {
    const resolved = resolve(variant, components);
    const kind = String(resolved.properties?.kind?.const ?? '');
    return { kind, rows: walkRows(resolved, prefix, components) };
  });
}
