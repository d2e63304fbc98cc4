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
