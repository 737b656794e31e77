import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/errors.js';
import { parseObserved } from '../../src/io/observed.js';

// Invented star and planet ids.
const KNOWN = new Set(['Orvel-2', 'Orvel-2 b', 'Sanu']);
const HEADER = 'target,midBjdTdb,midUtc,instrument,rvMps,rvErrorMps';
const parse = (body: string, header = HEADER) => parseObserved(`${header}\n${body}\n`, 'obs.csv', KNOWN);

/** The single message line of a refused file. */
function message(body: string, header = HEADER): string {
  try {
    parse(body, header);
  } catch (err) {
    expect(err).toBeInstanceOf(InputError);
    return (err as Error).message;
  }
  throw new Error('expected an input error');
}

describe('observed-visits file', () => {
  it('reads BJD and UTC rows, with and without RVs, in any column order and case', () => {
    const rows = parseObserved(
      [
        '# invented visits',
        'INSTRUMENT,Target,MIDUTC,midbjdtdb,rverrormps,RVMPS',
        'echelle-2,Orvel-2 b,,2461000.61234,1.8,-3.25',
        'echelle-2,Sanu,2027-03-14T04:10:00+02:00,,,',
        '',
      ].join('\n'),
      'obs.csv',
      KNOWN,
    );
    expect(rows).toEqual([
      { targetId: 'Orvel-2 b', midBjdTdb: 2461000.61234, instrument: 'echelle-2', rvMps: -3.25, rvErrorMps: 1.8, row: 1, line: 3 },
      // +02:00 is two hours ahead of UTC (ISO 8601).
      { targetId: 'Sanu', midUtc: '2027-03-14T02:10:00.000Z', instrument: 'echelle-2', row: 2, line: 4 },
    ]);
  });

  it('allows a file with only its header (no visits yet)', () => {
    expect(parseObserved(`${HEADER}\n`, 'obs.csv', KNOWN)).toEqual([]);
  });

  it.each([
    [
      'unknown id',
      'Nobody,2461000.5,,echelle-2,,',
      'obs.csv: row 1 (line 2): target = "Nobody": a star or planet id of the target list (this id is not in it)',
    ],
    ['blank id', ',2461000.5,,echelle-2,,', 'obs.csv: row 1 (line 2): target = (empty): required: a star or planet id of the target list'],
    [
      'BJD out of range',
      'Sanu,61000.5,,echelle-2,,',
      'obs.csv: row 1 (line 2): midBjdTdb = "61000.5": mid-exposure as a full BJD_TDB in days, 2400000 to 2600000',
    ],
    ['BJD not a number', 'Sanu,soon,,echelle-2,,', 'obs.csv: row 1 (line 2): midBjdTdb = "soon": mid-exposure as a full BJD_TDB in days, 2400000 to 2600000'],
    [
      'UTC without a zone',
      'Sanu,,2027-03-14T02:10:00,echelle-2,,',
      'obs.csv: row 1 (line 2): midUtc = "2027-03-14T02:10:00": mid-exposure as ISO 8601 date and time with Z or an offset, e.g. 2027-03-14T02:10:00Z',
    ],
    ['UTC on a day that does not exist', 'Sanu,,2027-02-30T02:10:00Z,echelle-2,,', 'midUtc = "2027-02-30T02:10:00Z": mid-exposure as ISO 8601'],
    [
      'instrument with a blank',
      'Sanu,2461000.5,,echelle 2,,',
      'obs.csv: row 1 (line 2): instrument = "echelle 2": required: an instrument id of letters, digits and hyphens',
    ],
    ['instrument missing', 'Sanu,2461000.5,,,,', 'obs.csv: row 1 (line 2): instrument = (empty): required: an instrument id of letters, digits and hyphens'],
    ['RV too large', 'Sanu,2461000.5,,echelle-2,2e6,1', 'obs.csv: row 1 (line 2): rvMps = "2e6": measured radial velocity in m/s, -1e6 to 1e6'],
    ['RV error zero', 'Sanu,2461000.5,,echelle-2,3,0', 'obs.csv: row 1 (line 2): rvErrorMps = "0": 1-sigma RV uncertainty in m/s, 0.001 to 10000'],
    [
      'RV without its error',
      'Sanu,2461000.5,,echelle-2,3,',
      'obs.csv: row 1 (line 2): rvErrorMps = (empty): rvMps and rvErrorMps go together: both or neither',
    ],
    ['error without its RV', 'Sanu,2461000.5,,echelle-2,,2', 'obs.csv: row 1 (line 2): rvMps = (empty): rvMps and rvErrorMps go together: both or neither'],
    [
      'both times',
      'Sanu,2461000.5,2027-03-14T02:10:00Z,echelle-2,,',
      'obs.csv: row 1 (line 2): midUtc = "2027-03-14T02:10:00Z": give midBjdTdb or midUtc, not both',
    ],
    [
      'neither time',
      'Sanu,,,echelle-2,,',
      'obs.csv: row 1 (line 2): midBjdTdb = (empty): required: midBjdTdb (full BJD_TDB) or midUtc (ISO 8601 with Z or an offset)',
    ],
  ])('refuses %s with one line naming file, row, field, value and what is allowed', (_name, body, expected) => {
    const text = message(body);
    expect(text).toContain(expected);
    expect(text).not.toMatch(/\n/);
  });

  it('names the row of a later bad line', () => {
    expect(message('Sanu,2461000.4,,echelle-2,,\nSanu,,,echelle-2,,')).toMatch(/^obs\.csv: row 2 \(line 3\): midBjdTdb = \(empty\): required/);
  });

  it('refuses unknown columns, naming them and the allowed ones', () => {
    expect(message('Sanu,2461000.5,echelle-2,x', 'target,midBjdTdb,instrument,exposure')).toBe(
      'obs.csv: header: columns = "exposure": unknown column(s); allowed: target, midBjdTdb, midUtc, instrument, rvMps, rvErrorMps',
    );
  });

  it('refuses a header without a time column or without a required column', () => {
    expect(message('Sanu,echelle-2', 'target,instrument')).toBe(
      'obs.csv: header: midBjdTdb = (missing): a column midBjdTdb or midUtc is required; the header has: target, instrument',
    );
    expect(message('Sanu,2461000.5', 'target,midBjdTdb')).toBe(
      'obs.csv: header: instrument = (missing): required column missing; the header has: target, midBjdTdb',
    );
    expect(message('Sanu,Sanu,2461000.5,e', 'target,TARGET,midBjdTdb,instrument')).toBe('obs.csv: header column 2: column = "TARGET": each column once');
  });
});
