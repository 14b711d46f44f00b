/**
 * The method a lab usually reports for a parameter, offered when the parameter is picked (the
 * person can change it). All are among the approved methods of 40 CFR 136.3, Table IB (from
 * memory of that table; the certificate's own method is what is recorded). Flow is measured at
 * the site, not by a lab method.
 */
export const usualMethods: Record<string, string> = {
  'oil-grease-hem': '1664B',
  'non-polar-sgt-hem': '1664B',
  ph: 'SM 4500-H+ B',
  tss: 'SM 2540 D',
  temperature: 'SM 2550 B',
};

/** The methods offered in the method list. */
export const knownMethods = ['1664B', '1664A', 'SM 4500-H+ B', 'SM 2540 D', 'SM 2550 B'];

export const usualMethodOf = (parameterCode: string, fraction: string | null): string =>
  usualMethods[parameterCode] ?? (fraction ? '1664B' : '');
