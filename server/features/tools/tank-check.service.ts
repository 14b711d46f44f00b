import type { TankCheckRequest, TankCheckView } from '../../contracts/tools.js';
import { checkTank } from '../../domain/tank-check.js';
import { FOOT_METRES as FOOT_M, US_GALLON_LITRES } from '../../domain/units.js';

const minutes = (seconds: number) =>
  seconds >= 5940 ? `${(seconds / 3600).toFixed(1)} h` : `${Math.max(1, Math.round(seconds / 60))} min`;
const fixed = (value: number, digits: number) =>
  value.toLocaleString('en-US', { maximumFractionDigits: digits, minimumFractionDigits: digits });

export const TANK_CHECK_CAUTION =
  'An estimate for screening, not a design: Stokes\u2019 law for one droplet in still water, without turbulence, short-circuiting, inlet jets, emulsified oil or solids. ' +
  'It does not replace a licensed engineer, the equipment maker\u2019s sizing or local codes; local codes and the control authority govern. ' +
  'Before working on a tank, follow the site\u2019s lockout and confined-space rules and wear the protective equipment it requires.';

/** Runs the tank check in SI and answers in the person's own units and words. */
export function tankCheck(request: TankCheckRequest): TankCheckView {
  const us = request.unitSystem === 'us';
  const toM = (value: number) => (us ? value * FOOT_M : value);
  const surfaceM2 =
    request.shape === 'rectangular' ? toM(request.length!) * toM(request.width!) : Math.PI * (toM(request.diameter!) / 2) ** 2;
  const depthM = toM(request.depth);
  // US gal/min or m³/h → m³/s.
  const flowM3s = us ? (request.flow * US_GALLON_LITRES) / 1000 / 60 : request.flow / 3600;
  const celsius = us ? ((request.waterTemperature - 32) * 5) / 9 : request.waterTemperature;
  const check = checkTank({
    oilSpecificGravity: request.oilSpecificGravity,
    waterCelsius: celsius,
    dropletM: request.dropletMicrons * 1e-6,
    surfaceM2,
    depthM,
    flowM3s,
  });

  const flowText = (m3s: number) => (us ? `${fixed((m3s * 60_000) / US_GALLON_LITRES, 1)} gal/min` : `${fixed(m3s * 3600, 2)} m³/h`);
  const areaText = (m2: number) => (us ? `${fixed(m2 / FOOT_M ** 2, 1)} ft²` : `${fixed(m2, 2)} m²`);
  const speedText = (ms: number) => (us ? `${fixed((ms / FOOT_M) * 60, 3)} ft/min` : `${fixed(ms * 60, 4)} m/min`);
  const droplet = `${fixed(request.dropletMicrons, 0)} µm`;

  const summary =
    check.verdict === 'oil-sinks'
      ? `Oil of specific gravity ${request.oilSpecificGravity} is not lighter than the water: it will not rise.`
      : `Oil of ${droplet} needs ${minutes(check.riseSeconds)} to surface; water stays ${minutes(check.residenceSeconds)} — ${
          check.verdict === 'rises'
            ? `enough, with ${fixed(check.margin, 1)} times the time needed`
            : `too short: ${fixed(check.margin * 100, 0)} % of the time needed`
        }.`;
  const remedies =
    check.verdict === 'too-short'
      ? [
          `A smaller flow: at most ${flowText(check.remedies.maxFlowM3s)} through this tank.`,
          `More surface: at least ${areaText(check.remedies.surfaceNeededM2)} at this flow.`,
          `Larger droplets: this tank surfaces droplets of ${fixed(check.remedies.smallestDropletM * 1e6, 0)} µm and up (quiet inflow and coalescing media help them grow).`,
          'Warmer water: the water is less viscous and the oil rises faster.',
        ]
      : [];
  const stokesNote =
    check.stokes === 'applies'
      ? `Stokes\u2019 law applies: particle Reynolds number ${fixed(check.reynolds, 3)}, well below 1.`
      : check.stokes === 'approximate'
        ? `Stokes\u2019 law is only approximate here: particle Reynolds number ${fixed(check.reynolds, 2)}, close to 1; the real rise is slower.`
        : `Stokes\u2019 law does not apply: particle Reynolds number ${fixed(check.reynolds, 1)} is above 1; the droplet rises slower than shown.`;
  return {
    verdict: check.verdict,
    summary,
    remedies,
    stokes: check.stokes,
    stokesNote,
    figures: [
      { label: 'Water surface', value: areaText(surfaceM2) },
      { label: 'Water density', value: `${fixed(check.waterDensity, 1)} kg/m³` },
      { label: 'Water viscosity', value: `${fixed(check.waterViscosity * 1000, 3)} mPa·s` },
      { label: 'Oil density', value: `${fixed(check.oilDensity, 1)} kg/m³` },
      { label: `Rise velocity of ${droplet}`, value: speedText(check.riseVelocity) },
      { label: 'Surface loading (flow ÷ surface)', value: speedText(check.surfaceLoading) },
      { label: 'Rise time over the working depth', value: minutes(check.riseSeconds) },
      { label: 'Residence time (volume ÷ flow)', value: minutes(check.residenceSeconds) },
    ],
    caution: TANK_CHECK_CAUTION,
  };
}
