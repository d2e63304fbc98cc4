import { IMPULSE_CLASSES, impulseClassRank, parseMotorDesignation } from '../../server/flights/motor-designation';

describe('parseMotorDesignation', () => {
  it('should read class, average thrust and delay from C6-5', () => {
    expect(parseMotorDesignation('C6-5')).toEqual({
      designation: 'C6-5',
      impulseClass: 'C',
      averageThrustN: 6,
      delayS: 5,
      plugged: false,
      // NFPA 1125 motor classification, from memory: C is 5.01-10.00 N s
      totalImpulseMinNs: 5.01,
      totalImpulseMaxNs: 10,
    });
  });

  it('should keep a propellant letter after the delay out of the numbers (F32-6T)', () => {
    expect(parseMotorDesignation('F32-6T')).toMatchObject({
      impulseClass: 'F',
      averageThrustN: 32,
      delayS: 6,
      plugged: false,
    });
  });

  it('should read an adjustable medium delay with no number as a null delay (H128W-M)', () => {
    expect(parseMotorDesignation('H128W-M')).toMatchObject({
      designation: 'H128W-M',
      impulseClass: 'H',
      averageThrustN: 128,
      delayS: null,
      plugged: false,
      // NFPA 1125 motor classification, from memory: H is 160.01-320 N s
      totalImpulseMinNs: 160.01,
      totalImpulseMaxNs: 320,
    });
    expect(parseMotorDesignation('J350W-L')).toMatchObject({ impulseClass: 'J', delayS: null });
    expect(parseMotorDesignation('G64W-S')).toMatchObject({ impulseClass: 'G', delayS: null });
  });

  it('should mark a plugged motor (-P) with no delay', () => {
    expect(parseMotorDesignation('G80-P')).toMatchObject({
      impulseClass: 'G',
      averageThrustN: 80,
      delayS: null,
      plugged: true,
    });
  });

  it('should read a booster delay of zero as zero, not as missing', () => {
    expect(parseMotorDesignation('C6-0')).toMatchObject({ delayS: 0, plugged: false });
  });

  it('should read the fractional classes (1/2A3-4T, 1/4A3-3T)', () => {
    // NFPA 1125 motor classification, from memory: 1/2A is 0.626-1.25 N s, 1/4A 0.3126-0.625 N s
    expect(parseMotorDesignation('1/2A3-4T')).toMatchObject({
      impulseClass: '1/2A',
      averageThrustN: 3,
      delayS: 4,
      totalImpulseMinNs: 0.626,
      totalImpulseMaxNs: 1.25,
    });
    expect(parseMotorDesignation('1/4a3-3t')).toMatchObject({
      designation: '1/4A3-3T',
      impulseClass: '1/4A',
      totalImpulseMinNs: 0.3126,
      totalImpulseMaxNs: 0.625,
    });
  });

  it('should read A8-3 as the A class, more than 1.25 up to 2.50 N s', () => {
    // NFPA 1125 motor classification, from memory: A is 1.26-2.50 N s
    expect(parseMotorDesignation('A8-3')).toMatchObject({
      impulseClass: 'A',
      averageThrustN: 8,
      delayS: 3,
      totalImpulseMinNs: 1.26,
      totalImpulseMaxNs: 2.5,
    });
  });

  it('should accept spaces and lower case around the designation', () => {
    expect(parseMotorDesignation('  d12-5 ')).toMatchObject({
      designation: 'D12-5',
      impulseClass: 'D',
      averageThrustN: 12,
      delayS: 5,
    });
  });

  it('should read the larger classes up to O', () => {
    expect(parseMotorDesignation('K550W-L')?.impulseClass).toBe('K');
    expect(parseMotorDesignation('O5800-P')).toMatchObject({
      impulseClass: 'O',
      totalImpulseMaxNs: 40960,
      plugged: true,
    });
  });

  it.each(['', 'C', '1/4A', 'C0-5', 'P100-5', 'Z6-5', 'C6--5', '6-5', 'C6-5-5', 'C6-X', 'C6-123', '1/3A3-4', 'hello'])(
    'should refuse %j',
    (text) => {
      expect(parseMotorDesignation(text)).toBeNull();
    },
  );
});

describe('IMPULSE_CLASSES', () => {
  // Motor impulse classes double per letter (reference facts, from memory): H <= 320 ... O <= 40,960 N s.
  it.each([
    ['A', 1.26, 2.5],
    ['B', 2.51, 5],
    ['C', 5.01, 10],
    ['D', 10.01, 20],
    ['E', 20.01, 40],
    ['F', 40.01, 80],
    ['G', 80.01, 160],
    ['H', 160.01, 320],
    ['I', 320.01, 640],
    ['J', 640.01, 1280],
    ['K', 1280.01, 2560],
    ['L', 2560.01, 5120],
    ['M', 5120.01, 10240],
    ['N', 10240.01, 20480],
    ['O', 20480.01, 40960],
  ])('should give %s the range %d-%d N s', (cls, min, max) => {
    expect(IMPULSE_CLASSES.find((c) => c.impulseClass === cls)).toEqual({ impulseClass: cls, minNs: min, maxNs: max });
  });

  it('should order the classes from smallest to largest', () => {
    expect(impulseClassRank('1/4A')).toBe(0);
    expect(impulseClassRank('1/2A')).toBeLessThan(impulseClassRank('A'));
    expect(impulseClassRank('G')).toBeLessThan(impulseClassRank('h'));
    expect(impulseClassRank('Q')).toBe(-1);
  });
});
