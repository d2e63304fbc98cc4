import {
  flightWarnings,
  motorsLitAtLiftoff,
  thrustToWeight,
  totalImpulseMaxNs,
} from '../../server/flights/flight-warnings';
import { parseMotorDesignation, type MotorDesignation } from '../../server/flights/motor-designation';

const motor = (text: string): MotorDesignation => {
  const m = parseMotorDesignation(text);
  if (!m) throw new Error(`test motor ${text} did not parse`);
  return m;
};

const card = (over: Partial<Parameters<typeof flightWarnings>[0]> = {}) => ({
  liftoffMassGrams: 100,
  motors: [motor('C6-5')],
  expectedAltitudeMetres: null,
  ceilingMetres: null,
  allowedClasses: null,
  ...over,
});

const codes = (r: ReturnType<typeof flightWarnings>) => r.warnings.map((w) => w.code);

describe('thrustToWeight', () => {
  it('should divide average thrust by the weight under standard gravity', () => {
    // 6 N / (0.1 kg x 9.80665 m/s^2) = 6.1183 (standard gravity 9.80665, CGPM 1901)
    expect(thrustToWeight(100, [motor('C6-5')])).toBeCloseTo(6.1183, 3);
  });

  it('should add the motors of a cluster', () => {
    // 3 x 6 N / (0.3 kg x 9.80665) = 6.1183
    expect(thrustToWeight(300, [motor('C6-5'), motor('C6-5'), motor('C6-5')])).toBeCloseTo(6.1183, 3);
  });

  it('should count only the boosters of a staged rocket', () => {
    const stack = [motor('C6-0'), motor('C6-7')];
    expect(motorsLitAtLiftoff(stack).map((m) => m.designation)).toEqual(['C6-0']);
    expect(thrustToWeight(100, stack)).toBeCloseTo(6.1183, 3);
  });

  it('should give 0 for no mass', () => {
    expect(thrustToWeight(0, [motor('C6-5')])).toBe(0);
  });
});

describe('totalImpulseMaxNs', () => {
  it('should add the upper ends of the classes', () => {
    // NFPA 1125 motor classification, from memory: G up to 160 N s, H up to 320 N s
    expect(totalImpulseMaxNs([motor('G80-7T'), motor('G80-7T')])).toBe(320);
    expect(totalImpulseMaxNs([motor('H128W-M'), motor('C6-0')])).toBe(330);
  });
});

describe('flightWarnings', () => {
  it('should find nothing to say about a light rocket on a C6-5', () => {
    expect(flightWarnings(card())).toEqual({
      thrustToWeight: expect.closeTo(6.1183, 3),
      warnings: [],
      needsHighPower: false,
    });
  });

  it('should warn below 5 to 1 at liftoff (common practice, no source)', () => {
    // 6 N / (0.2 kg x 9.80665) = 3.06
    const r = flightWarnings(card({ liftoffMassGrams: 200 }));
    expect(r.thrustToWeight).toBeCloseTo(3.059, 3);
    expect(codes(r)).toEqual(['low_thrust_to_weight']);
    expect(r.warnings[0].message).toContain('3.1 times');
  });

  it('should not warn at 5 to 1 or above', () => {
    // 6 N / 5 / 9.80665 = 0.12236 kg: just under is fine
    expect(codes(flightWarnings(card({ liftoffMassGrams: 122 })))).toEqual([]);
    expect(codes(flightWarnings(card({ liftoffMassGrams: 123 })))).toEqual(['low_thrust_to_weight']);
  });

  it('should warn when the expected altitude is above the launch ceiling', () => {
    expect(codes(flightWarnings(card({ expectedAltitudeMetres: 400, ceilingMetres: 350 })))).toEqual(['above_ceiling']);
    expect(codes(flightWarnings(card({ expectedAltitudeMetres: 350, ceilingMetres: 350 })))).toEqual([]);
    expect(codes(flightWarnings(card({ expectedAltitudeMetres: 400, ceilingMetres: null })))).toEqual([]);
    expect(codes(flightWarnings(card({ expectedAltitudeMetres: null, ceilingMetres: 350 })))).toEqual([]);
  });

  // Model-rocket limits in the usual safety codes (NFPA 1122, from memory): 1,500 g at liftoff, 320 N s.
  it('should need high power above 1,500 g at liftoff', () => {
    const r = flightWarnings(card({ liftoffMassGrams: 1501, motors: [motor('G80-7T'), motor('G80-7T')] }));
    expect(r.needsHighPower).toBe(true);
    expect(codes(r)).toContain('high_power');
    expect(r.warnings.find((w) => w.code === 'high_power')!.message).toContain('1,501 g');
    expect(
      flightWarnings(card({ liftoffMassGrams: 1500, motors: [motor('G80-7T'), motor('G80-7T')] })).needsHighPower,
    ).toBe(false);
  });

  it('should need high power above 320 N s of total impulse', () => {
    const r = flightWarnings(
      card({ liftoffMassGrams: 1000, motors: [motor('G80-7T'), motor('G80-7T'), motor('D12-0')] }),
    );
    expect(r.needsHighPower).toBe(true);
    expect(r.warnings.find((w) => w.code === 'high_power')!.message).toContain('340 N·s');
  });

  it('should need high power for class H or above', () => {
    const r = flightWarnings(card({ liftoffMassGrams: 1200, motors: [motor('H128W-M')] }));
    expect(r.needsHighPower).toBe(true);
    expect(r.warnings.find((w) => w.code === 'high_power')!.message).toContain('H128W-M is class H or above');
  });

  it('should warn that nothing is verified when a high-power flight has no certification on record', () => {
    const r = flightWarnings(card({ liftoffMassGrams: 1200, motors: [motor('H128W-M')], allowedClasses: null }));
    expect(codes(r)).toEqual(['high_power', 'beyond_certification']);
    expect(
      flightWarnings(card({ liftoffMassGrams: 1200, motors: [motor('H128W-M')], allowedClasses: [] })).warnings.map(
        (w) => w.code,
      ),
    ).toContain('beyond_certification');
  });

  it('should not ask for a certification on a model-rocket flight', () => {
    expect(codes(flightWarnings(card({ allowedClasses: null })))).toEqual([]);
  });

  it('should warn about a class beyond the largest verified class', () => {
    const r = flightWarnings(card({ liftoffMassGrams: 2500, motors: [motor('J350W-L')], allowedClasses: ['H', 'I'] }));
    expect(codes(r)).toEqual(['high_power', 'beyond_certification']);
    expect(r.warnings[1].message).toContain('J350W-L is beyond');
    expect(r.warnings[1].message).toContain('up to I');
  });

  it('should accept any class up to the largest verified one, including model-rocket classes', () => {
    expect(
      codes(flightWarnings(card({ liftoffMassGrams: 1200, motors: [motor('H128W-M')], allowedClasses: ['H'] }))),
    ).toEqual(['high_power']);
    expect(codes(flightWarnings(card({ allowedClasses: ['H'] })))).toEqual([]);
  });

  it('should still ask for high-power certification when only model classes are verified', () => {
    const r = flightWarnings(
      card({
        liftoffMassGrams: 2000,
        motors: [motor('G80-7T'), motor('G80-7T')],
        allowedClasses: ['A', 'B', 'C', 'D', 'E', 'F', 'G'],
      }),
    );
    expect(codes(r)).toEqual(['high_power', 'beyond_certification']);
  });

  it('should word warnings, never a permission', () => {
    const r = flightWarnings(
      card({
        liftoffMassGrams: 8000,
        motors: [motor('J350W-L')],
        expectedAltitudeMetres: 2000,
        ceilingMetres: 1000,
        allowedClasses: ['H'],
      }),
    );
    expect(r.warnings.length).toBe(4);
    for (const w of r.warnings) expect(w.message).not.toMatch(/\b(approved|allowed to fly|cleared|safe to fly)\b/i);
  });
});
