import { checkParamSpecs, RUBRIC_SPEC, type Field, type Spec } from './spec.ts';

type Schema = Record<string, unknown>;

function schemaOf(spec: Spec, field?: Field): Schema {
  const base: Schema = { description: spec.description };
  if (field?.default !== undefined) base.default = field.default;
  switch (spec.kind) {
    case 'string':
      return { ...base, type: 'string', ...(spec.minLength ? { minLength: spec.minLength } : {}), ...(spec.patternText ? { pattern: spec.patternText } : {}) };
    case 'regex':
      return { ...base, type: 'string', format: 'regex' };
    case 'number':
    case 'integer':
      return { ...base, type: spec.nullable ? [spec.kind, 'null'] : spec.kind, ...(spec.min !== undefined ? { minimum: spec.min } : {}), ...(spec.max !== undefined ? { maximum: spec.max } : {}) };
    case 'boolean':
      return { ...base, type: 'boolean' };
    case 'enum':
      return { ...base, enum: [...spec.values] };
    case 'array':
      return { ...base, type: 'array', items: schemaOf(spec.of), ...(spec.minItems ? { minItems: spec.minItems } : {}), ...(spec.unique === 'value' ? { uniqueItems: true } : {}) };
    case 'map':
      return { ...base, type: 'object', ...(spec.keyPatternText ? { propertyNames: { pattern: spec.keyPatternText } } : {}), additionalProperties: schemaOf(spec.of) };
    case 'params':
      return { ...base, type: 'object' };
    case 'object': {
      const properties = Object.fromEntries(Object.entries(spec.fields).map(([k, f]) => [k, schemaOf(f, f)]));
      const required = Object.entries(spec.fields).filter(([, f]) => f.required).map(([k]) => k);
      const schema: Schema = { ...base, type: 'object', properties, additionalProperties: false };
      if (required.length) schema.required = required;
      if (spec.oneOf) schema.oneOf = spec.oneOf.map((keys) => ({ required: keys }));
      return schema;
    }
  }
}

/**
 * The JSON Schema (draft 2020-12) of rubric files, generated from the same spec the validator
 * walks. Each check's parameters are given by an if/then on the criterion's `check`.
 */
export function rubricJsonSchema(): Schema {
  const schema = schemaOf(RUBRIC_SPEC);
  const criteria = ((schema.properties as Schema).criteria as Schema).items as Schema;
  criteria.allOf = Object.entries(checkParamSpecs()).map(([check, params]) => ({
    if: { properties: { check: { const: check } }, required: ['check'] },
    then: { properties: { params: { type: 'object', additionalProperties: false, properties: Object.fromEntries(Object.entries(params).map(([k, s]) => [k, schemaOf(s)])) } } },
  }));
  return { $schema: 'https://json-schema.org/draft/2020-12/schema', $id: 'plumbline-rubric.schema.json', title: 'Plumbline rubric', ...schema };
}

/** The schema as the text of the file shipped in rubrics/. */
export function rubricJsonSchemaText(): string {
  return `${JSON.stringify(rubricJsonSchema(), null, 2)}\n`;
}
