import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { generateTransportDatasetTypes, TRANSPORT_DATASET_TYPES_PATH } from '@/lib/schema/generate-transport-dataset-types';
import { generateTransportDatasetValidator, TRANSPORT_DATASET_VALIDATOR_PATH } from '@/lib/schema/generate-transport-dataset-validator';
import { pascalCase, schemaToTypeScript, SchemaToTsError, typeOf } from '@/lib/schema/schema-to-ts';

describe('schema-to-ts generator', () => {
  it('keeps the committed transport-dataset types identical to what the schema generates', () => {
    const committed = readFileSync(path.resolve(import.meta.dirname, '../../..', TRANSPORT_DATASET_TYPES_PATH), 'utf8');
    expect(generateTransportDatasetTypes()).toBe(committed);
  });

  it('maps scalar types, enums, consts, arrays and unions', () => {
    expect(typeOf({ type: 'string' })).toBe('string');
    expect(typeOf({ type: 'integer' })).toBe('number');
    expect(typeOf({ type: ['string', 'null'] })).toBe('string | null');
    expect(typeOf({ enum: ['dc', "it's", 3] })).toBe("'dc' | 'it\\'s' | 3");
    expect(typeOf({ const: 'DOI' })).toBe("'DOI'");
    expect(typeOf({ type: 'array', items: { enum: ['x', 'y'] } })).toBe("('x' | 'y')[]");
    expect(typeOf({ anyOf: [{ type: 'number' }, { $ref: '#/$defs/unit' }] })).toBe('number | Unit');
    expect(typeOf({ allOf: [{ $ref: '#/$defs/a-b' }, { $ref: '#/$defs/c' }] })).toBe('AB & C');
    expect(typeOf({ type: 'object' })).toBe('Record<string, unknown>');
  });

  it('writes optional and required properties, quoted keys, index signatures and doc comments', () => {
    const out = typeOf({
      type: 'object',
      required: ['value'],
      properties: { value: { type: 'number', title: 'Value' }, 'unit-code': { type: 'string' } },
      additionalProperties: { type: 'number' },
    });
    expect(out).toBe("{\n  /** Value */\n  value: number;\n  'unit-code'?: string;\n  [key: string]: number;\n}");
  });

  it('declares the root and every $defs entry as named exports', () => {
    const text = schemaToTypeScript(
      {
        $id: 'https://example.invalid/s/1.0.0',
        type: 'object',
        additionalProperties: false,
        required: ['len'],
        properties: { len: { $ref: '#/$defs/length' } },
        $defs: { length: { type: 'object', additionalProperties: false, properties: { value: { type: 'number' } } }, unitCode: { enum: ['m', 'cm'] } },
      },
      { rootName: 'Root', source: 'x.json' },
    );
    expect(text).toContain('export interface Root {\n  len: Length;\n}');
    expect(text).toContain('export interface Length {\n  value?: number;\n}');
    expect(text).toContain("export type UnitCode = 'm' | 'cm';");
    expect(text).toContain('// Schema $id: https://example.invalid/s/1.0.0');
  });

  it('refuses what it cannot translate rather than guessing', () => {
    expect(() => typeOf({ $ref: 'other.json#/x' })).toThrow(SchemaToTsError);
    expect(() => typeOf({ title: 'no type' })).toThrow(/without type/);
    expect(() => schemaToTypeScript({ type: 'object', properties: {}, $defs: { 'a-b': { type: 'string' }, aB: { type: 'string' } } }, { rootName: 'R', source: 's' })).toThrow(/AB/);
    expect(pascalCase('positiveLength')).toBe('PositiveLength');
  });
});

describe('precompiled record validator', () => {
  it('keeps the committed standalone validator identical to what Ajv compiles from the schema', () => {
    const committed = readFileSync(path.resolve(import.meta.dirname, '../../..', TRANSPORT_DATASET_VALIDATOR_PATH), 'utf8');
    expect(generateTransportDatasetValidator()).toBe(committed);
  });
});
