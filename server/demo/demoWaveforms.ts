/**
 * Invented captures for the demo project and the browser tests: waveforms on which meters disagree,
 * each with what it shows. Deterministic (seeded noise), so the same files come out every time.
 */
export interface DemoCapture {
  file: string;
  name: string;
  tags: string[];
  sampleRate: number;
  seconds: number;
  channels: { name: string; unit: string; at: (t: number, noise: () => number) => number }[];
}

const TAU = 2 * Math.PI;

function seeded(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), a | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296 - 0.5;
  };
}

const mains = (f: number, peak: number, phase = 0) => (t: number) => peak * Math.sin(TAU * f * t + phase);

/** Leading-edge phase control: conducts from the firing angle to the end of each half-cycle. */
const phaseCut = (f: number, peak: number, alphaDeg: number) => (t: number) => {
  const theta = (TAU * f * t) % TAU;
  return theta % Math.PI >= (alphaDeg * Math.PI) / 180 ? peak * Math.sin(theta) : 0;
};

/** Capacitor-input rectifier line current: a half-sine pulse of width w around each voltage crest. */
const rectifierPulses = (f: number, peak: number, widthDeg: number) => (t: number) => {
  const theta = ((TAU * f * t) % TAU) * (180 / Math.PI);
  for (const [centre, sign] of [[90, 1], [270, -1]] as const) {
    const d = theta - centre;
    if (Math.abs(d) < widthDeg / 2) return sign * peak * Math.cos((Math.PI * d) / widthDeg);
  }
  return 0;
};

/** Three-level quasi-square ("modified sine") output: ±peak for a share of each half-cycle, else 0. */
const modifiedSine = (f: number, peak: number, onShare: number) => (t: number) => {
  const p = (f * t) % 1;
  const half = p < 0.5 ? p * 2 : (p - 0.5) * 2;
  const on = Math.abs(half - 0.5) < onShare / 2;
  return on ? (p < 0.5 ? peak : -peak) : 0;
};

const DEG = Math.PI / 180;

/**
 * An invented switchboard incomer during a lift motor start: slightly unbalanced phase voltages
 * (231 V∠0°, 226 V∠−119°, 234 V∠121° RMS) that dip to 72 % from 0.2 s to 0.3 s while the motor draws
 * about 4.5 times its running current at a poorer power factor. The dip starts and ends on whole
 * cycles, so the whole-record phasors keep the designed unbalance (u2 1.592 %, u0 0.442 %, NEMA 1.443 %).
 */
function switchboardPhase(k: 0 | 1 | 2) {
  const v = [231, 226, 234][k];
  const vAngle = [0, -119, 121][k] * DEG;
  const iRms = [38, 40, 37][k];
  const starting = (t: number) => t >= 0.2 && t < 0.3;
  return {
    voltage: (t: number) => (starting(t) ? 0.72 : 1) * mains(50, v * Math.SQRT2, vAngle)(t),
    current: (t: number) => (starting(t) ? mains(50, 4.5 * iRms * Math.SQRT2, vAngle - 70 * DEG)(t) : mains(50, iRms * Math.SQRT2, vAngle - 25 * DEG)(t)),
  };
}

const triangleCarrier = (fc: number) => (t: number) => 2 * Math.abs(2 * ((t * fc) % 1) - 1) - 1;

export function demoCaptures(): DemoCapture[] {
  const carrier = triangleCarrier(4000);
  return [
    {
      file: 'mains-clean-230V.csv', name: 'Incoming supply, L1-N (reference sine)', tags: ['supply', 'reference'], sampleRate: 20000, seconds: 0.2,
      channels: [{ name: 'L1-N', unit: 'V', at: (t, n) => mains(50, 325.3)(t) + 0.3 * n() }],
    },
    {
      file: 'inverter-square-wave.csv', name: 'Emergency lighting inverter, square-wave output', tags: ['inverter'], sampleRate: 50000, seconds: 0.2,
      channels: [{ name: 'Out', unit: 'V', at: (t, n) => ((50 * t) % 1 < 0.5 ? 230 : -230) + 0.5 * n() }],
    },
    {
      file: 'inverter-modified-sine.csv', name: 'Workshop UPS on battery, modified-sine output', tags: ['ups', 'inverter'], sampleRate: 50000, seconds: 0.2,
      channels: [{ name: 'Out', unit: 'V', at: (t, n) => modifiedSine(50, 325, 0.5)(t) + 0.5 * n() }],
    },
    {
      file: 'dimmer-120deg.csv', name: 'Corridor dimmer at a low setting (firing angle 120°)', tags: ['lighting', 'dimmer'], sampleRate: 50000, seconds: 0.2,
      channels: [
        { name: 'Lamp voltage', unit: 'V', at: (t, n) => phaseCut(50, 325.3, 120)(t) + 0.4 * n() },
        { name: 'Lamp current', unit: 'A', at: (t, n) => phaseCut(50, 325.3 / 529, 120)(t) + 0.002 * n() },
      ],
    },
    {
      file: 'rectifier-current.csv', name: 'Control cabinet supply: capacitor-input rectifier current', tags: ['rectifier', 'harmonics'], sampleRate: 20000, seconds: 0.2,
      channels: [
        { name: 'L1-N', unit: 'V', at: (t, n) => mains(50, 322)(t) + 0.3 * n() },
        { name: 'L1', unit: 'A', at: (t, n) => rectifierPulses(50, 4.2, 50)(t) + 0.01 * n() },
      ],
    },
    {
      file: 'dc-supply-ripple.csv', name: 'Telemetry 24 V supply with 100 Hz ripple', tags: ['dc'], sampleRate: 20000, seconds: 0.2,
      channels: [{ name: 'DC out', unit: 'V', at: (t, n) => 24 + 1.2 * Math.abs(Math.sin(TAU * 50 * t)) - 0.76 + 0.02 * n() }],
    },
    {
      file: 'pwm-drive-output.csv', name: 'Pump drive output, U-V (sine PWM, 4 kHz carrier)', tags: ['drive', 'pwm'], sampleRate: 200000, seconds: 0.1,
      channels: [{ name: 'U-V', unit: 'V', at: (t, n) => (0.85 * Math.sin(TAU * 40 * t) > carrier(t) ? 560 : -560) + 2 * n() }],
    },
    {
      file: 'supply-with-anomalies.csv', name: 'Pump start on the supply: sag, spike, then clipping in a swell', tags: ['supply', 'anomalies'], sampleRate: 20000, seconds: 0.6,
      channels: [
        {
          name: 'L1-N', unit: 'V',
          at: (t, n) => {
            // A sag to 82 % while the pump starts, a switching spike, then a swell past the scope's ±340 V range.
            const gain = t >= 0.2 && t < 0.3 ? 0.82 : t >= 0.5 ? 1.1 : 1;
            let v = mains(50, 325.3)(t) * gain + 0.3 * n();
            if (Math.abs(t - 0.4552) < 0.0001) v += 450;
            return Math.max(-340, Math.min(340, v));
          },
        },
      ],
    },
    {
      file: 'switchboard-three-phase-motor-start.csv', name: 'Switchboard MSB-2 incomer: lift motor start, three phases', tags: ['supply', 'three-phase', 'dip'], sampleRate: 10000, seconds: 0.6,
      channels: [
        ...([0, 1, 2] as const).map((k) => ({ name: `L${k + 1}-N`, unit: 'V', at: (t: number, n: () => number) => switchboardPhase(k).voltage(t) + 0.3 * n() })),
        ...([0, 1, 2] as const).map((k) => ({ name: `I L${k + 1}`, unit: 'A', at: (t: number, n: () => number) => switchboardPhase(k).current(t) + 0.05 * n() })),
      ],
    },
  ];
}

/** The capture as CSV text in a common scope layout: a time column in seconds and one column per channel. */
export function demoCsv(c: DemoCapture, seed = 7): string {
  const noise = seeded(seed);
  const n = Math.round(c.sampleRate * c.seconds);
  const lines = [`Time (s),${c.channels.map((ch) => `${ch.name} (${ch.unit})`).join(',')}`];
  for (let i = 0; i < n; i++) {
    const t = i / c.sampleRate;
    lines.push(`${t.toPrecision(9)},${c.channels.map((ch) => ch.at(t, noise).toPrecision(6)).join(',')}`);
  }
  return lines.join('\n') + '\n';
}
