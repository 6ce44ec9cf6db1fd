/**
 * A small JSON Schema subset: request bodies and queries are validated with it, and the same
 * objects are published in the OpenAPI document, so the two cannot drift apart.
 */
export type Schema =
  | { type: 'string'; minLength?: number; maxLength?: number; enum?: readonly string[]; pattern?: string; description?: string; default?: string }
  | { type: 'number' | 'integer'; minimum?: number; maximum?: number; exclusiveMinimum?: number; exclusiveMaximum?: number; description?: string; default?: number }
  | { type: 'boolean'; description?: string; default?: boolean }
  | { type: 'null'; description?: string }
  | { type: 'array'; items: Schema; minItems?: number; maxItems?: number; description?: string }
  | {
      type: 'object';
      properties: Record<string, Schema>;
      required?: readonly string[];
      additionalProperties?: boolean | Schema;
      description?: string;
    }
  | { oneOf: readonly Schema[]; description?: string; default?: unknown }
  | { description?: string }; // anything

/** One validation failure: where, and what is wrong. */
export interface SchemaIssue {
  path: string;
  message: string;
}

function typeName(v: unknown): string {
  if (v === null) return 'null';
  if (Array.isArray(v)) return 'array';
  return typeof v;
}

/**
 * Checks `value` against `schema`; returns the issues (empty when valid). Stops collecting
 * after `limit` issues so a hostile body cannot make the answer huge.
 */
export function validate(schema: Schema, value: unknown, path = '', out: SchemaIssue[] = [], limit = 20): SchemaIssue[] {
  if (out.length >= limit) return out;
  const at = path || '(body)';
  if ('oneOf' in schema) {
    const ok = schema.oneOf.some((s) => validate(s, value, path, [], 1).length === 0);
    if (!ok) out.push({ path: at, message: 'does not match any of the allowed forms' });
    return out;
  }
  if (!('type' in schema)) return out;
  switch (schema.type) {
    case 'string':
      if (typeof value !== 'string') out.push({ path: at, message: `must be a string, not ${typeName(value)}` });
      else if (schema.enum && !schema.enum.includes(value)) out.push({ path: at, message: `must be one of ${schema.enum.map((x) => JSON.stringify(x)).join(', ')}` });
      else if (schema.minLength !== undefined && value.length < schema.minLength) out.push({ path: at, message: `must have at least ${schema.minLength} characters` });
      else if (schema.maxLength !== undefined && value.length > schema.maxLength) out.push({ path: at, message: `must have at most ${schema.maxLength} characters` });
      else if (schema.pattern && !new RegExp(schema.pattern).test(value)) out.push({ path: at, message: `has an invalid format` });
      return out;
    case 'number':
    case 'integer':
      if (typeof value !== 'number' || !Number.isFinite(value)) out.push({ path: at, message: `must be a finite number, not ${typeName(value)}` });
      else if (schema.type === 'integer' && !Number.isInteger(value)) out.push({ path: at, message: 'must be a whole number' });
      else if (schema.minimum !== undefined && value < schema.minimum) out.push({ path: at, message: `must be at least ${schema.minimum}` });
      else if (schema.maximum !== undefined && value > schema.maximum) out.push({ path: at, message: `must be at most ${schema.maximum}` });
      else if (schema.exclusiveMinimum !== undefined && value <= schema.exclusiveMinimum) out.push({ path: at, message: `must be greater than ${schema.exclusiveMinimum}` });
      else if (schema.exclusiveMaximum !== undefined && value >= schema.exclusiveMaximum) out.push({ path: at, message: `must be less than ${schema.exclusiveMaximum}` });
      return out;
    case 'boolean':
      if (typeof value !== 'boolean') out.push({ path: at, message: `must be true or false, not ${typeName(value)}` });
      return out;
    case 'null':
      if (value !== null) out.push({ path: at, message: `must be null, not ${typeName(value)}` });
      return out;
    case 'array':
      if (!Array.isArray(value)) {
        out.push({ path: at, message: `must be an array, not ${typeName(value)}` });
        return out;
      }
      if (schema.minItems !== undefined && value.length < schema.minItems) out.push({ path: at, message: `must have at least ${schema.minItems} items` });
      if (schema.maxItems !== undefined && value.length > schema.maxItems) {
        out.push({ path: at, message: `must have at most ${schema.maxItems} items (got ${value.length})` });
        return out;
      }
      for (let i = 0; i < value.length && out.length < limit; i++) validate(schema.items, value[i], `${path}[${i}]`, out, limit);
      return out;
    case 'object': {
      if (value === null || typeof value !== 'object' || Array.isArray(value)) {
        out.push({ path: at, message: `must be an object, not ${typeName(value)}` });
        return out;
      }
      const obj = value as Record<string, unknown>;
      for (const r of schema.required ?? []) if (obj[r] === undefined) out.push({ path: path ? `${path}.${r}` : r, message: 'is required' });
      for (const [k, v] of Object.entries(obj)) {
        if (out.length >= limit) break;
        const p = path ? `${path}.${k}` : k;
        const sub = schema.properties[k];
        if (sub) validate(sub, v, p, out, limit);
        else if (schema.additionalProperties === false) out.push({ path: p, message: 'is not a known field' });
        else if (typeof schema.additionalProperties === 'object') validate(schema.additionalProperties, v, p, out, limit);
      }
      return out;
    }
  }
}
