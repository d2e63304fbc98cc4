import { centsToDecimal, csvCell, toCsv } from '../../server/platform/csv';

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

  it('should join rows with CRLF', () => {
    expect(toCsv(['a', 'b'], [[1, 'x,y']])).toBe('a,b\r\n1,"x,y"\r\n');
  });
});

describe('centsToDecimal', () => {
  it('should write cents as dollars with two decimals', () => {
    expect(centsToDecimal(112)).toBe('1.12');
    expect(centsToDecimal(-5)).toBe('-0.05');
    expect(centsToDecimal(0)).toBe('0.00');
  });
});
