/**
 * COMTRADE records written by hand, field by field, from the layout of IEEE C37.111-1999 clauses 6 and 7
 * and the 2013 edition (as summarised in DOMAIN.md §8e [S; layout M]). The clause numbers beside each line
 * are from memory. Invented station and channel names; no file of any vendor or tool was looked at.
 */

const lines = (...l: string[]) => l.join('\r\n') + '\r\n';

/**
 * 1999, ASCII: a VT secondary in kV (P/S flag S, ratio 132:0.11 so ×1200 to primary), a CT in primary
 * amperes with an offset, and a trip contact. 1000 S/s, six samples, the trigger 2 ms after the first.
 */
export const EASTFIELD_CFG = lines(
  'Eastfield 132kV,Bay 4 relay,1999', // 6.4.1 station_name,rec_dev_id,rev_year
  '3,2A,1D', // 6.4.2 TT,##A,##D
  '1,VA,A,Line 4,kV,0.01,0,0,-32767,32767,132,0.11,S', // 6.4.3 An,ch_id,ph,ccbm,uu,a,b,skew,min,max,primary,secondary,PS
  '2,IA,A,Line 4,A,0.5,0.25,12.5,-32767,32767,600,1,P', // 6.4.3, with a skew of 12.5 µs
  '1,TRIP,,Line 4 breaker,0', // 6.4.4 Dn,ch_id,ph,ccbm,y
  '50', // 6.4.5 lf
  '1', // 6.4.6 nrates
  '1000,6', // 6.4.6 samp,endsamp
  '05/03/2024,14:22:31.250000', // 6.4.7 first sample, dd/mm/yyyy,hh:mm:ss.ssssss
  '05/03/2024,14:22:31.252000', // 6.4.7 trigger
  'ASCII', // 6.4.8 ft
  '1', // 6.4.9 timemult
);

export const EASTFIELD_DAT = lines(
  '1,0,11,100,0', // 7.2 n,timestamp,A1,A2,D1
  '2,1000,-11,-100,0',
  '3,2000,99999,50,0', // 99999: a missing A1 value (the 1999 text, from memory)
  '4,3000,22,,1', // an empty A2 field: also missing; the trip contact closes
  '5,4000,0,0,1',
  '6,5000,5,-50,0', // the contact opens again
);

/** What EASTFIELD reads as, worked out by hand: primary = (a·x + b) × ratio for an S channel. */
export const EASTFIELD_PRIMARY = {
  VA: [132, -132, NaN, 264, 0, 60], // kV: 0.01·x × 1200
  IA: [50.25, -49.75, 25.25, NaN, 0.25, -24.75], // A: 0.5·x + 0.25
};
export const EASTFIELD_SECONDARY = {
  VA: [0.11, -0.11, NaN, 0.22, 0, 0.05], // kV: 0.01·x
  IA: [50.25 / 600, -49.75 / 600, 25.25 / 600, NaN, 0.25 / 600, -24.75 / 600], // A: (0.5·x + 0.25) / 600
};

/**
 * 2013 configuration for a binary record: one current in BINARY32 with two status inputs; the 2013
 * time-code and time-quality lines at the end. nrates 0: the time stamps (timemult 10 µs) give the time.
 */
export const WESTGATE_CFG_LINES = [
  'Westgate 33kV,Feeder recorder 2,2013', // station_name,rec_dev_id,rev_year (2013)
  '3,1A,2D', // TT,##A,##D
  '1,IN,N,Feeder 2,A,0.001,0,0,-2000000,2000000,400,5,P', // An,…,PS
  '1,52A,,Breaker 2,0', // Dn,ch_id,ph,ccbm,y
  '2,TRIP,,Feeder 2 relay,0',
  '50', // lf
  '0', // nrates 0: timestamps only
  '0,5', // 0,endsamp
  '11/11/2024,09:00:00.000000000', // first sample, nanosecond fraction (2013)
  '11/11/2024,09:00:00.000200000', // trigger, 200 µs later
  'BINARY32', // ft
  '10', // timemult: time stamps count tens of µs
  '+1h,+1h', // time_code,local_code (2013)
  'F,0', // tmq_code,leapsec (2013)
];

/**
 * The .dat for WESTGATE, record by record (2013 binary layout, from memory): uint32 sample number,
 * uint32 time stamp, int32 per analog value, then one uint16 holding the status bits, D1 in bit 0.
 */
export const WESTGATE_RECORDS: [n: number, timestamp: number, raw: number, status: number][] = [
  [1, 0, 1000, 0b01], // 52A closed, TRIP open
  [2, 10, -1000, 0b01], // 10 × 10 µs = 100 µs after the first sample
  [3, 20, -0x80000000, 0b11], // 0x80000000: the missing int32 value; TRIP picks up
  [4, 30, 2500, 0b10], // breaker opens
  [5, 40, 0, 0b10],
];

export function westgateDat(): Uint8Array {
  const out = new Uint8Array(WESTGATE_RECORDS.length * 14);
  const dv = new DataView(out.buffer);
  WESTGATE_RECORDS.forEach(([n, ts, raw, status], i) => {
    dv.setUint32(i * 14, n, true);
    dv.setUint32(i * 14 + 4, ts, true);
    dv.setInt32(i * 14 + 8, raw, true);
    dv.setUint16(i * 14 + 12, status, true);
  });
  return out;
}
