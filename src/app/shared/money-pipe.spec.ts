import { MoneyPipe } from './money-pipe';

describe('MoneyPipe', () => {
  const pipe = new MoneyPipe();

  it('should show cents as Canadian dollars with two decimals', () => {
    expect(pipe.transform(1999)).toBe('$19.99');
    expect(pipe.transform(0)).toBe('$0.00');
    expect(pipe.transform(123456)).toBe('$1,234.56');
  });

  it('should show nothing for a missing amount', () => {
    expect(pipe.transform(null)).toBe('');
  });
});
