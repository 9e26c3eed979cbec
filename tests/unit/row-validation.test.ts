import { describe, expect, it } from 'vitest';
import { duplicateKey, parseIsoDate, parseNumber, parseSaleType, validateRow } from '../../server/modules/sales-import/row-validation';

describe('parseNumber', () => {
  it.each([
    ['412500', 412_500],
    ['$1,234.50', 1_234.5],
    [' 1 234 ', 1_234],
    ['€ 99', 99],
    ['£2,500,000', 2_500_000],
    ['-850', -850],
    ['+12', 12],
    ['.5', 0.5],
    ['7.', 7],
    ['1e3', 1_000],
    ['1_640', 1_640],
  ])('reads %j as %d', (raw, expected) => {
    expect(parseNumber(raw)).toBe(expected);
  });

  it.each(['', 'abc', 'call the agent', '12.5.3', '=SUM(A1:A9)', '1e999', 'Infinity', 'NaN', '0x1F', '12abc', '1-2'])('refuses %j', (raw) => {
    expect(parseNumber(raw)).toBeNaN();
  });
});

describe('parseIsoDate', () => {
  it.each([
    ['2024-02-29', '2024-02-29'],
    ['2000-02-29', '2000-02-29'],
    ['2026-03-14', '2026-03-14'],
    ['2026/03/14', '2026-03-14'],
    ['2026-3-4', '2026-03-04'],
    [' 2025-12-31 ', '2025-12-31'],
  ])('reads %j as %s', (raw, expected) => {
    expect(parseIsoDate(raw)).toBe(expected);
  });

  it.each(['2025-02-29', '1900-02-29', '2025-02-30', '2025-04-31', '2025-13-01', '2025-00-10', '2025-06-00'])('says %s is not a real date, naming it', (raw) => {
    const result = parseIsoDate(raw);
    expect(typeof result).toBe('object');
    expect((result as { error: string }).error).toContain(raw);
  });

  it.each(['14/03/2026', '03/14/2026', '14 March 2026', '20260314', ''])('refuses the ambiguous or non-ISO form %j', (raw) => {
    expect(parseIsoDate(raw)).toEqual({ error: expect.stringMatching(/year-month-day/) });
  });
});

describe('parseSaleType', () => {
  it.each([
    ['', 'arms_length'],
    ["Arm's length", 'arms_length'],
    ['Arm’s-Length', 'arms_length'],
    ['ARMS LENGTH', 'arms_length'],
    ['arms_length', 'arms_length'],
    ['Market', 'arms_length'],
    ['Short sale', 'distressed'],
    ['REO', 'distressed'],
    ['Foreclosure', 'distressed'],
    ['Bank owned', 'distressed'],
    ['Family transfer', 'family'],
    ['Related party', 'family'],
    ["Non-arm's length", 'family'],
    ['non_arms_length', 'family'],
    ['Estate sale', 'estate'],
    ['Probate', 'estate'],
    ['New construction', 'new_construction'],
    ['new_construction', 'new_construction'],
    ['Other', 'other'],
  ])('reads %j as %s', (raw, expected) => {
    expect(parseSaleType(raw)).toBe(expected);
  });

  it('answers null for a word it does not know', () => {
    expect(parseSaleType('Auction')).toBeNull();
  });
});

const mapping = { address: 'Address', salePrice: 'Price', saleDate: 'Closed', floorArea: 'Area', lon: 'Lon', lat: 'Lat', saleType: 'Type' };
const goodRow = { Address: '9 Mooring Way', Price: '$402,000', Closed: '2026-05-20', Area: '1,575', Lon: '-61.41', Lat: '44.708', Type: '' };
const TODAY = '2026-06-30';

describe('validateRow', () => {
  it('turns a good row into a sale with defaults for the unmapped fields', () => {
    const result = validateRow(goodRow, mapping, 2, TODAY);
    expect(result).toEqual({
      ok: true,
      sale: expect.objectContaining({
        address: '9 Mooring Way',
        salePrice: 402_000,
        saleDate: '2026-05-20',
        floorArea: 1_575,
        lon: -61.41,
        lat: 44.708,
        saleType: 'arms_length',
        sellerConcessions: 0,
        bedrooms: null,
        lotSize: null,
        neighbourhood: null,
      }),
    });
  });

  function problemsOf(raw: Record<string, string>, rowNumber = 7) {
    const result = validateRow(raw, mapping, rowNumber, TODAY);
    if (result.ok) throw new Error('expected the row to be refused');
    return result.problems;
  }

  it('names the row and the field of a missing sale price', () => {
    const problems = problemsOf({ ...goodRow, Price: '  ' }, 7);
    expect(problems).toEqual([{ row: 7, field: expect.stringMatching(/sale price/i), message: expect.stringMatching(/missing/i) }]);
  });

  it('quotes a price that is not a number', () => {
    const [problem] = problemsOf({ ...goodRow, Price: 'ask the agent' }, 12);
    expect(problem).toMatchObject({ row: 12, field: expect.stringMatching(/sale price/i) });
    expect(problem.message).toContain('ask the agent');
  });

  it('refuses an impossible date and a future date on the sale date field', () => {
    const [impossible] = problemsOf({ ...goodRow, Closed: '2025-02-29' }, 3);
    expect(impossible).toMatchObject({ row: 3, field: expect.stringMatching(/sale date/i) });
    expect(impossible.message).toContain('2025-02-29');
    const [future] = problemsOf({ ...goodRow, Closed: '2026-07-01' }, 4);
    expect(future).toMatchObject({ row: 4, field: expect.stringMatching(/sale date/i) });
    expect(future.message).toContain('2026-07-01');
    expect(validateRow({ ...goodRow, Closed: TODAY }, mapping, 5, TODAY).ok).toBe(true);
  });

  it('refuses a negative floor area and a longitude beyond 180', () => {
    expect(problemsOf({ ...goodRow, Area: '-850' }, 8)).toEqual([{ row: 8, field: expect.stringMatching(/floor area/i), message: expect.any(String) }]);
    expect(problemsOf({ ...goodRow, Lon: '200' }, 9)).toEqual([{ row: 9, field: expect.stringMatching(/longitude/i), message: expect.stringMatching(/180/) }]);
  });

  it('asks for both coordinates or neither', () => {
    expect(problemsOf({ ...goodRow, Lat: '' }, 6)).toEqual([{ row: 6, field: expect.stringMatching(/latitude/i), message: expect.stringMatching(/both/i) }]);
    expect(validateRow({ ...goodRow, Lat: '', Lon: '' }, mapping, 6, TODAY)).toMatchObject({ ok: true, sale: { lon: null, lat: null } });
  });

  it('lists every problem of a row, not just the first', () => {
    const problems = problemsOf({ ...goodRow, Address: '', Price: 'n/a', Type: 'Auction' }, 20);
    expect(problems.map((p) => p.row)).toEqual([20, 20, 20]);
    expect(problems.map((p) => p.field)).toEqual([expect.stringMatching(/address/i), expect.stringMatching(/sale price/i), expect.stringMatching(/sale type/i)]);
  });

  it('treats a required field with no mapped column as missing', () => {
    const { floorArea: _unmapped, ...partial } = mapping;
    const result = validateRow(goodRow, partial, 2, TODAY);
    expect(result.ok).toBe(false);
    expect(!result.ok && result.problems).toEqual([{ row: 2, field: expect.stringMatching(/floor area/i), message: expect.stringMatching(/missing/i) }]);
  });
});

describe('duplicateKey', () => {
  it('folds case, spaces and punctuation of the address but keeps the date apart', () => {
    expect(duplicateKey('12 Mooring Way', '2026-01-05')).toBe(duplicateKey('  12  MOORING way. ', '2026-01-05'));
    expect(duplicateKey('12 Mooring Way', '2026-01-05')).not.toBe(duplicateKey('12 Mooring Way', '2026-01-06'));
    expect(duplicateKey('12 Mooring Way', '2026-01-05')).not.toBe(duplicateKey('21 Mooring Way', '2026-01-05'));
  });
});
