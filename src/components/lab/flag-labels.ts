/** Short names for the lab checks' findings, as shown on chips and in the flag filter. */
export const flagLabels: Record<string, string> = {
  'over-limit': 'Over limit',
  'below-limit': 'Below minimum',
  'holding-time': 'Holding time',
  'field-composite': 'Field composite',
  'preservation-not-confirmed': 'Preservation unconfirmed',
  'warm-on-receipt': 'Warm on receipt',
  'below-ml-as-number': 'Below ML as number',
  'excess-precision': 'Extra digits',
  'qc-opr': 'OPR out of range',
  'qc-ms-recovery': 'MS recovery',
  'qc-msd-recovery': 'MSD recovery',
  'qc-rpd': 'MS/MSD RPD',
  'qc-method-blank': 'Method blank',
  'analysed-before-collected': 'Analysed before collected',
  'collected-in-future': 'Future collection',
  'unit-not-convertible': 'Unit mismatch',
  'no-limit': 'No limit here',
  'above-rating': 'Above rating',
  'negative-balance': 'Negative balance',
  'above-capacity': 'Above capacity',
  'spcc-threshold': 'Spill plan threshold',
  'halogens-presumption': 'Halogens over 1,000 ppm',
  'off-specification': 'Off-specification fuel',
};

export const flagLabel = (code: string) => flagLabels[code] ?? code;
