/** The label every limit verdict carries, in the report and on screen. */
export const INDICATIVE_NOTE =
  'Indicative only: the standard prescribes its own measurement method (IEC 61000-4-7 windows, smoothing and observation periods, instrument class), and a single capture is not a compliance test. Defer to the utility, the local code and an accredited laboratory.';
