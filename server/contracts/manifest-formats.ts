/**
 * Formats from EPA's instructions for the uniform hazardous waste manifest (EPA Form 8700-22)
 * and 40 CFR 262.21(f)(2): a manifest tracking number is 12 characters, 9 digits then 3 letters.
 * An EPA ID number is 12 characters, site-specific; most start with the 2-letter state code
 * (from memory). Validated no stricter than 12 upper-case letters or digits, starting with 2 letters.
 */
export const MANIFEST_TRACKING_NUMBER = /^\d{9}[A-Z]{3}$/;
export const EPA_ID_NUMBER = /^[A-Z]{2}[A-Z0-9]{10}$/;
