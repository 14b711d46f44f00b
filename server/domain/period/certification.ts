/**
 * The certification a periodic report is signed with, by the permit's kind. The wording is the
 * regulation's own (40 CFR 403.6(a)(2)(ii) and 122.22(d) carry the same text); see
 * product.md, "Sign-off", for where it was read.
 */
const penaltyOfLaw =
  'I certify under penalty of law that this document and all attachments were prepared under my direction or supervision ' +
  'in accordance with a system designed to assure that qualified personnel properly gather and evaluate the information ' +
  'submitted. Based on my inquiry of the person or persons who manage the system, or those persons directly responsible ' +
  'for gathering the information, the information submitted is, to the best of my knowledge and belief, true, accurate, ' +
  'and complete. I am aware that there are significant penalties for submitting false information, including the ' +
  'possibility of fine and imprisonment for knowing violations.';

export interface CertificationStatement {
  /** Where the text is. */
  section: string;
  /** Why this report carries it. */
  requiredBy: string;
  text: string;
}

export const certificationStatements: Record<'pretreatment' | 'npdes', CertificationStatement> = {
  pretreatment: { section: '40 CFR 403.6(a)(2)(ii)', requiredBy: '40 CFR 403.12(l)', text: penaltyOfLaw },
  npdes: { section: '40 CFR 122.22(d)', requiredBy: '40 CFR 122.22(b)', text: penaltyOfLaw },
};
