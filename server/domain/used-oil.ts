import type { Flag } from '../contracts/flags.js';

/**
 * 40 CFR 279.10(b)(1)(ii): used oil containing more than 1,000 ppm total halogens is presumed
 * to have been mixed with halogenated hazardous waste, unless the presumption is rebutted.
 */
export const HALOGEN_PRESUMPTION_PPM = 1000;

/** 40 CFR 279.11, Table 1: used oil fuel specification (ppm, flash point in °F). */
export const fuelSpecification = {
  arsenicMaxPpm: 5,
  cadmiumMaxPpm: 2,
  chromiumMaxPpm: 10,
  leadMaxPpm: 100,
  flashPointMinF: 100,
  totalHalogensMaxPpm: 4000,
} as const;

export interface UsedOilAnalysis {
  totalHalogensPpm: number | null;
  burnedAsFuel: boolean;
  arsenicPpm: number | null;
  cadmiumPpm: number | null;
  chromiumPpm: number | null;
  leadPpm: number | null;
  flashPointF: number | null;
}

export function usedOilFlags(analysis: UsedOilAnalysis): Flag[] {
  const flags: Flag[] = [];
  if (analysis.totalHalogensPpm !== null && analysis.totalHalogensPpm > HALOGEN_PRESUMPTION_PPM) {
    flags.push({
      code: 'halogens-presumption',
      severity: 'error',
      message: `Total halogens ${analysis.totalHalogensPpm} ppm, above ${HALOGEN_PRESUMPTION_PPM} ppm: presumed mixed with hazardous waste unless rebutted`,
      source: '40 CFR 279.10(b)(1)(ii)',
    });
  }
  if (!analysis.burnedAsFuel) return flags;
  const spec = fuelSpecification;
  const over: string[] = [];
  if (analysis.arsenicPpm !== null && analysis.arsenicPpm > spec.arsenicMaxPpm)
    over.push(`arsenic ${analysis.arsenicPpm} ppm > ${spec.arsenicMaxPpm}`);
  if (analysis.cadmiumPpm !== null && analysis.cadmiumPpm > spec.cadmiumMaxPpm)
    over.push(`cadmium ${analysis.cadmiumPpm} ppm > ${spec.cadmiumMaxPpm}`);
  if (analysis.chromiumPpm !== null && analysis.chromiumPpm > spec.chromiumMaxPpm)
    over.push(`chromium ${analysis.chromiumPpm} ppm > ${spec.chromiumMaxPpm}`);
  if (analysis.leadPpm !== null && analysis.leadPpm > spec.leadMaxPpm) over.push(`lead ${analysis.leadPpm} ppm > ${spec.leadMaxPpm}`);
  if (analysis.flashPointF !== null && analysis.flashPointF < spec.flashPointMinF)
    over.push(`flash point ${analysis.flashPointF} °F < ${spec.flashPointMinF}`);
  if (analysis.totalHalogensPpm !== null && analysis.totalHalogensPpm > spec.totalHalogensMaxPpm) {
    over.push(`total halogens ${analysis.totalHalogensPpm} ppm > ${spec.totalHalogensMaxPpm}`);
  }
  if (over.length > 0) {
    flags.push({
      code: 'off-specification',
      severity: 'warning',
      message: `Off-specification used oil fuel: ${over.join('; ')}`,
      source: '40 CFR 279.11, Table 1',
    });
  }
  return flags;
}
