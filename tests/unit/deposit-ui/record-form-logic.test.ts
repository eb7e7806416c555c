import { describe, expect, it } from 'vitest';
import schema from '@/schemas/transport-dataset.schema.json';
import { checkRecord } from '@/components/deposit/record/record-check';
import { getAt, removeAt, setAt } from '@/components/deposit/record/record-paths';
import { numberToText, parseNumberText, textMatches } from '@/components/deposit/record/number-text';
import { choiceLabel, childKeys, kindOf, nodeAt, unitChoices } from '@/components/deposit/record/schema-walk';

describe('schema walk: the form is drawn from schemas/transport-dataset.schema.json', () => {
  it('finds titles, kinds and unit lists through $ref', () => {
    const thickness = nodeAt(['sample', 'geometry', 'thickness'])!;
    expect(thickness.title).toBe('Thickness'); // usage-site title wins over the $def (positiveLength has none)
    expect(kindOf(thickness)).toBe('quantity');
    expect(unitChoices(thickness)).toEqual(schema.$defs.lengthUnit.enum);
    expect(kindOf(nodeAt(['sample'])!)).toBe('group');
    expect(childKeys(nodeAt(['sample'])!)).toEqual(Object.keys(schema.$defs.sample.properties));
    expect(kindOf(nodeAt(['creators'])!)).toBe('list');
    expect(kindOf(nodeAt(['keywords'])!)).toBe('tags');
    expect(kindOf(nodeAt(['description'])!)).toBe('longtext');
    expect(kindOf(nodeAt(['license'])!)).toBe('choice');
    expect(kindOf(nodeAt(['measurement', 'detection', 'filterOrder'])!)).toBe('integer');
    expect(nodeAt(['creators', 0, 'orcid'])!.title).toBe('ORCID iD');
    expect(nodeAt(['nothing-here'])).toBeUndefined();
  });

  it('words enum values the way the trade writes them', () => {
    expect(choiceLabel('van-der-pauw')).toBe('Van der Pauw');
    expect(choiceLabel('dc-reversal')).toBe('DC reversal');
    expect(choiceLabel('digital-lock-in')).toBe('Digital lock\u2011in');
    expect(choiceLabel('CC-BY-4.0')).toBe('CC-BY-4.0');
    expect(choiceLabel(24)).toBe('24');
  });
});

describe('record paths', () => {
  it('sets deep values immutably and removes emptied objects', () => {
    const before = { title: 'x' };
    const after = setAt(before, ['sample', 'geometry', 'thickness', 'value'], 20);
    expect(before).toEqual({ title: 'x' });
    expect(after).toEqual({ title: 'x', sample: { geometry: { thickness: { value: 20 } } } });
    expect(setAt(after, ['sample', 'geometry', 'thickness', 'value'], undefined)).toEqual({ title: 'x' });
  });

  it('keeps list entries the author added, and removes them on request', () => {
    const r = setAt({}, ['creators', 1], {});
    expect(getAt(r, ['creators'])).toEqual([{}, {}]);
    const named = setAt(r, ['creators', 1, 'name'], 'Ada Penhallow');
    expect(removeAt(named, ['creators'], 0)).toEqual({ creators: [{ name: 'Ada Penhallow' }] });
    expect(removeAt({ creators: [{}] }, ['creators'], 0)).toEqual({});
  });
});

describe('number fields keep what was typed', () => {
  it('parses numbers with a point or a decimal comma, and keeps anything else as text', () => {
    expect(parseNumberText('0.1')).toBe(0.1);
    expect(parseNumberText('0,1')).toBe(0.1);
    expect(parseNumberText(' 2e-3 ')).toBe(0.002);
    expect(parseNumberText('')).toBeUndefined();
    expect(parseNumberText('20 mm')).toBe('20 mm');
    expect(numberToText(0.1)).toBe('0.1');
    expect(textMatches('0.10', 0.1)).toBe(true);
    expect(textMatches('0.1', 0.2)).toBe(false);
  });
});

describe('live check with the server validator', () => {
  it('shows wrong values inline, and missing ones only where their parent exists', () => {
    const record = { title: 'Cu wire', creators: [{}], sample: { geometry: { thickness: { value: -1, unit: 'mm' } } } };
    const check = checkRecord(record);
    expect(check.complete).toBe(false);
    expect(check.inline['sample.geometry.thickness.value']).toBe('Thickness must be greater than 0.');
    expect(check.inline['creators.0.name']).toBe('Name is required.');
    expect(check.inline['sample.name']).toBe('Sample name is required.');
    // 'measurement' hangs off the root: listed as missing, not painted on an untouched form.
    expect(check.inline.measurement).toBeUndefined();
    expect(check.missing.map((e) => e.path)).toContain('measurement');
    expect(check.wrong.map((e) => e.path)).toEqual(['sample.geometry.thickness.value']);
  });

  it('reports a number typed as text by its field title', () => {
    const check = checkRecord({ sample: { geometry: { width: { value: '2 mm', unit: 'mm' } } } });
    expect(check.inline['sample.geometry.width.value']).toBe('Width must be a number.');
  });

  it('accepts the schema example as complete', () => {
    expect(checkRecord(schema.examples[0])).toEqual({ inline: {}, wrong: [], missing: [], complete: true });
  });
});
