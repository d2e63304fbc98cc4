import { centsToDecimal, csvCell, csvInstant, csvLines, inDateOrder, toCsv } from '../../server/platform/csv';

describe('csvCell', () => {
  // OWASP "CSV Injection": cells beginning with = + - @ tab or CR are prefixed with a single quote.
  it.each([
    ['=1+2', `"'=1+2"`],
    ['+SUM(A1)', `"'+SUM(A1)"`],
    ['-2+3', `"'-2+3"`],
    ['@cmd', `"'@cmd"`],
    ['\tx', `"'\tx"`],
    ['\rx', `"'\rx"`],
  ])('should neutralise %j', (input, expected) => {
    expect(csvCell(input)).toBe(expected);
  });

  // OWASP CSV Injection: in a locale whose list separator is `;`, a spreadsheet starts a new cell after every `;`
  // (quotes only count at the start of a field), so a formula may begin there too.
  describe('ASVS 5.3.1: a formula after a semicolon or behind a leading TAB, CR or spaces', () => {
    it.each([
      ['ok;=HYPERLINK("http://x.example")', `"ok;'=HYPERLINK(""http://x.example"")"`],
      ['a; +1', `"a; '+1"`],
      ['a;-2+3;@SUM(A1)', `"a;'-2+3;'@SUM(A1)"`],
      ['x;\t=1', `"x;'\t=1"`],
      ['\t=1+2', `"'\t=1+2"`],
      ['\r=1+2', `"'\r=1+2"`],
      ['  =1+2', `"'  =1+2"`],
    ])('should neutralise %j', (input, expected) => {
      expect(csvCell(input)).toBe(expected);
    });

    it('should quote any cell holding a semicolon, so a semicolon locale keeps it together when it honours quotes', () => {
      expect(csvCell('one;two')).toBe('"one;two"');
    });

    it('should leave a semicolon followed by ordinary text alone apart from the quoting', () => {
      expect(csvCell('Gopher Flats; Manitoba')).toBe('"Gopher Flats; Manitoba"');
    });

    it('should neutralise every such cell in a whole export', () => {
      const csv = toCsv(['name', 'note'], [['Ann;=cmd|"/c calc"!A1', '\t@x']]);
      // No line of the output, split at ; or , the way either locale would, starts a cell with a trigger character.
      for (const cell of csv.trim().split(/[;,\r\n]+/)) expect(cell.replace(/^"/, '')).not.toMatch(/^ *[=+\-@\t\r]/);
    });
  });

  it('should keep plain negative numbers as numbers', () => {
    expect(csvCell('-12.50')).toBe('-12.50');
    expect(csvCell(-3)).toBe('-3');
  });

  // RFC 4180 section 2: fields with commas, quotes or line breaks are quoted; quotes are doubled.
  it('should quote commas, quotes and line breaks', () => {
    expect(csvCell('a,b')).toBe('"a,b"');
    expect(csvCell('say "hi"')).toBe('"say ""hi"""');
    expect(csvCell('two\nlines')).toBe('"two\nlines"');
    expect(csvCell(null)).toBe('');
  });

  it('should start with the UTF-8 byte-order mark and join rows with CRLF', () => {
    expect(toCsv(['a', 'b'], [[1, 'x,y']])).toBe('\uFEFFa,b\r\n1,"x,y"\r\n');
    expect(Buffer.from(toCsv(['a'], [])).subarray(0, 3)).toEqual(Buffer.from([0xef, 0xbb, 0xbf]));
  });

  it('should give later chunks of a streamed export without mark or header', () => {
    expect(
      csvLines([
        [1, 2],
        ['x', null],
      ]),
    ).toBe('1,2\r\nx,\r\n');
    expect(csvLines([])).toBe('');
  });
});

describe('csvInstant', () => {
  // IANA tz database, northamerica, Rule Canada: 2026-11-01 07:00 UTC is when Winnipeg goes back to -06:00.
  it('should write ISO 8601 in club time with the offset, to the minute', () => {
    expect(csvInstant(new Date('2026-11-01T06:59:59Z'), 'America/Winnipeg')).toBe('2026-11-01T01:59-05:00');
    expect(csvInstant('2026-11-01T07:00:00Z', 'America/Winnipeg')).toBe('2026-11-01T01:00-06:00');
    expect(csvInstant(null, 'America/Winnipeg')).toBe('');
  });
});

describe('inDateOrder', () => {
  it('should sort by the instant, not by the text of the wall-clock time', () => {
    // 01:30 at -05:00 comes before 01:10 at -06:00 on the night the clocks go back.
    const rows = [
      { id: 'b', at: new Date('2026-11-01T07:10:00Z') },
      { id: 'a', at: new Date('2026-11-01T06:30:00Z') },
    ];
    expect(inDateOrder(rows, (r) => r.at).map((r) => r.id)).toEqual(['a', 'b']);
  });

  it('should put rows without a date last and keep ties in their order', () => {
    const rows = [
      { id: 1, d: null },
      { id: 2, d: '2026-05-02' },
      { id: 3, d: '2026-05-01' },
      { id: 4, d: '2026-05-02' },
    ];
    expect(inDateOrder(rows, (r) => r.d).map((r) => r.id)).toEqual([3, 2, 4, 1]);
  });
});

describe('centsToDecimal', () => {
  it('should write cents as dollars with two decimals', () => {
    expect(centsToDecimal(112)).toBe('1.12');
    expect(centsToDecimal(-5)).toBe('-0.05');
    expect(centsToDecimal(0)).toBe('0.00');
  });
});
