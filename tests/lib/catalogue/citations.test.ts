// The rule that a changed catalogue value names its source in the same edit (issue 23).
import { describe, expect, it } from 'vitest';
import { CITED_BY, missingCitations, sameCatalogueValue } from '@/lib/catalogue/citations';
import { columnByField } from '@/lib/catalogue/columns';
import { CATALOGUE_KINDS } from '@/lib/catalogue/schemas';

describe('missingCitations', () => {
  const before = { thermalResistivityKmPerW: '3.5', resistivitySource: 'IEC 60287-2-1 Table 1', name: 'PE sheath', emissivity: null, emissivitySource: 'x' };

  it('asks for the source of a changed value, not of an unchanged one or a name', () => {
    expect(missingCitations('coverings', before, { thermalResistivityKmPerW: '3.6' })).toEqual([{ field: 'thermalResistivityKmPerW', sourceField: 'resistivitySource' }]);
    expect(missingCitations('coverings', before, { thermalResistivityKmPerW: '3.50' })).toEqual([]);
    expect(missingCitations('coverings', before, { name: 'Polyethylene sheath' })).toEqual([]);
  });

  it('counts a source sent with the value, but not a blank one; an emptied or a first value needs one too', () => {
    expect(missingCitations('coverings', before, { thermalResistivityKmPerW: '3.6', resistivitySource: 'Datasheet' })).toEqual([]);
    expect(missingCitations('coverings', before, { thermalResistivityKmPerW: '3.6', resistivitySource: ' ' })).toHaveLength(1);
    expect(missingCitations('coverings', before, { emissivity: '0.9' })).toEqual([{ field: 'emissivity', sourceField: 'emissivitySource' }]);
    expect(missingCitations('coverings', { ...before, emissivity: '0.9' }, { emissivity: '' })).toHaveLength(1);
  });

  it('names, for every cited value, a source column of the same part', () => {
    for (const kind of CATALOGUE_KINDS) {
      for (const [field, source] of Object.entries(CITED_BY[kind])) {
        expect(columnByField(kind, field), `${kind}.${field}`).toBeDefined();
        expect(columnByField(kind, source)?.type, `${kind}.${source}`).toBe('text');
      }
    }
  });
});

describe('sameCatalogueValue', () => {
  it('compares decimals by value and empties alike', () => {
    expect([sameCatalogueValue('0.9', '0.90'), sameCatalogueValue('1.7241e-8', '0.000000017241'), sameCatalogueValue(null, ''), sameCatalogueValue('0.9', null), sameCatalogueValue('xlpe', 'pvc')]).toEqual([
      true,
      true,
      true,
      false,
      false,
    ]);
  });
});
