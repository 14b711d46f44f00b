import { unit } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { checkTank, DESIGN_DROPLET_M, waterDensity, waterViscosity } from '../../server/domain/tank-check.js';

// Published water properties at 1 atm: International Critical Tables (1928, 1929), as tabulated in
// the Encyclopedia of Environmental Science and Engineering, Appendix, Table 2 (density g/cm³,
// absolute viscosity cP).
const criticalTables: Array<[number, number, number]> = [
  [0, 0.99987, 1.7921],
  [5, 0.99999, 1.5188],
  [10, 0.99973, 1.3097],
  [15, 0.99913, 1.1447],
  [20, 0.99823, 1.0087],
  [25, 0.99707, 0.8949],
  [30, 0.99568, 0.8004],
  [35, 0.99406, 0.7208],
];

describe('water properties for the tank check', () => {
  it.each(criticalTables)(
    'at %s °C: density within 0.01 % and viscosity within 2.5 % of the International Critical Tables',
    (celsius, density, viscosity) => {
      expect(Math.abs(waterDensity(celsius) / (density * 1000) - 1)).toBeLessThan(1e-4);
      expect(Math.abs(waterViscosity(celsius) / (viscosity / 1000) - 1)).toBeLessThan(0.025);
    },
  );
});

describe('does the oil have time to rise', () => {
  // A 150 µm droplet (API Publication 421's design droplet) of oil SG 0.85 in water at 20 °C:
  // v = g Δρ d² / 18 μ, worked by hand: oil 0.85 × 999.0 kg/m³ (water at 60 °F) = 849.2, water 998.2 kg/m³ and
  // 1.0016 mPa·s at 20 °C: 9.80665 × 149.0 × (150e-6)² / (18 × 1.0016e-3) ≈ 1.82 mm/s.
  const tank = { oilSpecificGravity: 0.85, waterCelsius: 20, surfaceM2: 2, depthM: 1.2, flowM3s: 0.002 };

  it('gives the Stokes rise velocity of the design droplet, in the Stokes regime', () => {
    const check = checkTank(tank);
    expect(check.dropletM).toBe(DESIGN_DROPLET_M);
    expect(check.riseVelocity * 1000).toBeCloseTo(1.82, 2);
    expect(check.reynolds).toBeLessThan(0.3);
    expect(check.stokes).toBe('applies');
  });

  it('says the water leaves too soon when the flow per unit of surface is above the rise velocity', () => {
    const check = checkTank(tank);
    // Surface loading 1 mm/s < 1.82 mm/s: rises. Residence 1,200 s vs rise 658 s.
    expect(check.verdict).toBe('rises');
    expect(check.margin).toBeCloseTo(1.82, 1);
    const busy = checkTank({ ...tank, flowM3s: 0.005 });
    expect(busy.verdict).toBe('too-short');
    expect(busy.margin).toBeLessThan(1);
    // Each remedy on its own brings the loading back to the rise velocity.
    expect(busy.remedies.maxFlowM3s).toBeCloseTo(busy.riseVelocity * tank.surfaceM2, 12);
    expect(checkTank({ ...tank, flowM3s: 0.005, surfaceM2: busy.remedies.surfaceNeededM2 }).margin).toBeCloseTo(1, 9);
    expect(checkTank({ ...tank, flowM3s: 0.005, dropletM: busy.remedies.smallestDropletM }).margin).toBeCloseTo(1, 9);
  });

  it('rises faster in warmer water, whose viscosity is lower', () => {
    expect(checkTank({ ...tank, waterCelsius: 35 }).riseVelocity).toBeGreaterThan(checkTank({ ...tank, waterCelsius: 10 }).riseVelocity);
  });

  it('says when oil heavier than water will not rise, and when Stokes no longer applies', () => {
    expect(checkTank({ ...tank, oilSpecificGravity: 1.02 }).verdict).toBe('oil-sinks');
    expect(checkTank({ ...tank, dropletM: 2e-3 }).stokes).toBe('does-not-apply');
  });

  it('takes US units through conversions that agree with mathjs (a general-purpose units library)', () => {
    // 100 gal/min through a 6 ft × 4 ft tank, 3 ft deep.
    const flow = unit(100, 'gal/minute').toNumber('m^3/s');
    const area = unit(24, 'ft^2').toNumber('m^2');
    expect(flow).toBeCloseTo((100 * 3.785411784) / 1000 / 60, 12);
    expect(area).toBeCloseTo(24 * 0.3048 ** 2, 12);
    const check = checkTank({ ...tank, flowM3s: flow, surfaceM2: area, depthM: unit(3, 'ft').toNumber('m') });
    expect(check.surfaceLoading).toBeCloseTo(flow / area, 12);
  });

  it('grows with the square of the droplet and with the density difference, and falls as the water grows more viscous', () => {
    const base = checkTank(tank);
    expect(checkTank({ ...tank, dropletM: 300e-6 }).riseVelocity / base.riseVelocity).toBeCloseTo(4, 9);
    const lighter = checkTank({ ...tank, oilSpecificGravity: 0.75 });
    expect(lighter.riseVelocity / base.riseVelocity).toBeCloseTo(
      (lighter.waterDensity - lighter.oilDensity) / (base.waterDensity - base.oilDensity),
      9,
    );
    const cold = checkTank({ ...tank, waterCelsius: 5 });
    // Density changes a little too: compare Δρ/μ, what Stokes' law scales with.
    expect(cold.riseVelocity / base.riseVelocity).toBeCloseTo(
      ((cold.waterDensity - cold.oilDensity) / cold.waterViscosity) * (base.waterViscosity / (base.waterDensity - base.oilDensity)),
      9,
    );
    expect(cold.riseVelocity).toBeLessThan(base.riseVelocity);
  });

  it('flips its verdict where the rise time equals the residence time', () => {
    const atBalance = checkTank(tank).remedies.maxFlowM3s;
    expect(checkTank({ ...tank, flowM3s: atBalance * 0.999 }).verdict).toBe('rises');
    expect(checkTank({ ...tank, flowM3s: atBalance * 1.001 }).verdict).toBe('too-short');
    const balanced = checkTank({ ...tank, flowM3s: atBalance });
    expect(balanced.riseSeconds).toBeCloseTo(balanced.residenceSeconds, 6);
  });
});
