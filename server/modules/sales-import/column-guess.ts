import { importFieldNames, importFields, type ColumnMapping } from '../../contracts/sales-import';

const normalise = (header: string) => header.toLowerCase().replace(/[_\-./()²]+/g, ' ').replace(/\s+/g, ' ').trim();

/** Guesses which header feeds each field: the user's saved mapping first (where its header is in
 * this file), then exact synonyms, then a synonym contained in the header. Each header is used once. */
export function guessMapping(headers: readonly string[], saved: ColumnMapping = {}): ColumnMapping {
  const mapping: ColumnMapping = {};
  const used = new Set<string>();
  const take = (field: (typeof importFieldNames)[number], header: string) => {
    mapping[field] = header;
    used.add(header);
  };
  for (const field of importFieldNames) {
    const header = saved[field];
    if (header && headers.includes(header) && !used.has(header)) take(field, header);
  }
  for (const pass of ['exact', 'contains'] as const) {
    for (const field of importFieldNames) {
      if (mapping[field]) continue;
      const synonyms = importFields[field].synonyms;
      const hit = headers.find((h) => {
        if (used.has(h)) return false;
        const n = normalise(h);
        return pass === 'exact' ? synonyms.includes(n as never) : synonyms.some((s) => s.length > 3 && n.includes(s));
      });
      if (hit) take(field, hit);
    }
  }
  return mapping;
}
