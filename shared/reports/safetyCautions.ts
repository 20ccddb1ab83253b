/**
 * The cautions every report ends with, in the words of the app's safety notice (SafetyNotice.vue and
 * the README's "Safety"): measurement category, qualified persons, local codes.
 */
export const SAFETY_CAUTIONS = [
  "Measuring mains and other high-energy circuits is work for qualified persons. Follow local codes, your site's rules and licensed practice; Crestline does not replace them.",
  'Every part of the chain (meter, leads, probes, clamps) must be rated for the measurement category and voltage of the point you measure; the lowest rating applies. CAT II: equipment on plugs. CAT III: building installation, distribution boards, fixed wiring. CAT IV: the origin of the installation, service entrance, utility meters.',
  'Most oscilloscope inputs are earth-referenced: a probe’s reference lead on a live conductor is a short circuit through protective earth. Use rated differential probes or isolated inputs on mains.',
  'An AC-coupled meter does not show a DC part. A small AC reading does not mean a circuit is safe to touch: check AC+DC.',
  'Clipped captures (flat tops at the instrument’s limits) understate peaks; re-capture with a larger range before you judge insulation or component ratings.',
];

export const SAFETY_CLOSING = 'Crestline analyses captures; it does not make a measurement safe, and an AC-coupled reading never proves that a circuit is safe to touch.';
