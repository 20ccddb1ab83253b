/** Crestline's channel colours, in channel order: the charts on screen and in reports use the same. */
export const CHANNEL_COLOURS = ['#2b8a82', '#d08a1c', '#8e5ba8', '#4f6fb3', '#b3474f', '#5f8f3a'];

/** The report's own colours, from the app's theme: petrol primary, warm-grey text and rules, amber for cautions. */
export const REPORT_COLOURS = {
  primary: '#1d5a56',
  text: '#25231f',
  muted: '#686357',
  rule: '#e0ddd5',
  band: '#f8f7f4',
  amber: '#e0a526',
  danger: '#c2410c',
  pass: '#216f69',
  logoWave: '#f4c95d',
} as const;
