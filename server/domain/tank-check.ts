/**
 * Does the oil have time to rise? A gravity check of a tank, sump or separator: the rise velocity
 * of a design oil droplet by Stokes' law, against the time the water stays and the flow per unit
 * of surface. An estimate for screening, not a design: it ignores turbulence, short-circuiting,
 * inlet jets and emulsions, which a licensed engineer and the equipment maker weigh.
 */

/** Standard gravity, m/s² (exact; CGPM 1901, as in NIST SP 330). */
export const STANDARD_GRAVITY = 9.80665;

/**
 * The design droplet of gravity oil-water separators: 150 µm (0.015 cm), API Publication 421,
 * "Design and Operation of Oil-Water Separators" (1990). Smaller droplets are not expected to rise
 * in a gravity unit.
 */
export const DESIGN_DROPLET_M = 150e-6;

/**
 * Density of air-free water at 1 atm, kg/m³, 0–40 °C: the Thiesen–Scheel–Diesselhorst form
 * ρ = 1000·(1 − (T + 288.9414)(T − 3.9863)² / (508929.2 (T + 68.12963))).
 */
export function waterDensity(celsius: number): number {
  return 1000 * (1 - ((celsius + 288.9414) * (celsius - 3.9863) ** 2) / (508929.2 * (celsius + 68.12963)));
}

/** Dynamic viscosity of liquid water, Pa·s: Vogel's equation μ = A·10^(B/(T − C)), A = 2.414e-5 Pa·s, B = 247.8 K, C = 140 K. */
export function waterViscosity(celsius: number): number {
  return 2.414e-5 * 10 ** (247.8 / (celsius + 273.15 - 140));
}

/**
 * Oil density from its specific gravity. Specific gravity of oils is quoted against water at
 * 60 °F (15.56 °C), as API gravity is (API MPMS Ch. 11.1): ρ = SG × ρwater(15.56 °C).
 */
export const oilDensity = (specificGravity: number) => specificGravity * waterDensity(15.56);

export interface TankCheckInput {
  /** Oil specific gravity (60/60 °F), below 1 for oil that floats. */
  oilSpecificGravity: number;
  waterCelsius: number;
  /** Design droplet diameter, m (default 150 µm, API 421). */
  dropletM?: number;
  /** Water surface of the tank, m². */
  surfaceM2: number;
  /** Working depth, m: the height a droplet entering at the bottom must rise. */
  depthM: number;
  /** Flow through, m³/s. */
  flowM3s: number;
}

export interface TankCheck {
  waterDensity: number;
  waterViscosity: number;
  oilDensity: number;
  dropletM: number;
  /** Rise velocity of the design droplet, m/s (Stokes). */
  riseVelocity: number;
  /** Particle Reynolds number ρw·v·d/μ: Stokes' law holds well below 1. */
  reynolds: number;
  stokes: 'applies' | 'approximate' | 'does-not-apply';
  /** Seconds for the droplet to rise the working depth. */
  riseSeconds: number;
  /** Hydraulic residence time, volume ÷ flow, s. */
  residenceSeconds: number;
  /** Surface loading rate, flow ÷ surface, m/s (the overflow rate). */
  surfaceLoading: number;
  /** Residence time ÷ rise time; at least 1 for the droplet to surface. */
  margin: number;
  verdict: 'rises' | 'too-short' | 'oil-sinks';
  /** What would let the design droplet surface, each on its own. */
  remedies: { maxFlowM3s: number; surfaceNeededM2: number; smallestDropletM: number };
}

export function checkTank(input: TankCheckInput): TankCheck {
  const rhoW = waterDensity(input.waterCelsius);
  const mu = waterViscosity(input.waterCelsius);
  const rhoO = oilDensity(input.oilSpecificGravity);
  const d = input.dropletM ?? DESIGN_DROPLET_M;
  const delta = rhoW - rhoO;
  const riseVelocity = (STANDARD_GRAVITY * delta * d * d) / (18 * mu);
  const reynolds = (rhoW * Math.abs(riseVelocity) * d) / mu;
  const residenceSeconds = (input.surfaceM2 * input.depthM) / input.flowM3s;
  const surfaceLoading = input.flowM3s / input.surfaceM2;
  const riseSeconds = riseVelocity > 0 ? input.depthM / riseVelocity : Infinity;
  // In a tank of uniform depth, rise time within residence time is the same test as surface loading within rise velocity.
  const margin = riseVelocity > 0 ? residenceSeconds / riseSeconds : 0;
  return {
    waterDensity: rhoW,
    waterViscosity: mu,
    oilDensity: rhoO,
    dropletM: d,
    riseVelocity,
    reynolds,
    // Stokes' drag is within a few per cent below Re ≈ 0.3 (common practice, no published source for the cut-off).
    stokes: reynolds < 0.3 ? 'applies' : reynolds < 1 ? 'approximate' : 'does-not-apply',
    riseSeconds,
    residenceSeconds,
    surfaceLoading,
    margin,
    verdict: delta <= 0 ? 'oil-sinks' : margin >= 1 ? 'rises' : 'too-short',
    remedies: {
      maxFlowM3s: riseVelocity > 0 ? riseVelocity * input.surfaceM2 : 0,
      surfaceNeededM2: riseVelocity > 0 ? input.flowM3s / riseVelocity : Infinity,
      smallestDropletM: delta > 0 ? Math.sqrt((18 * mu * surfaceLoading) / (STANDARD_GRAVITY * delta)) : Infinity,
    },
  };
}
