import { applyChannelSetup, isIdentityScaling } from '../../shared/analysis';
import type { ChannelSetup } from '../../shared/schemas/channelSetup';
import type { ParsedChannel } from './ingestTask';

/**
 * The parsed channels in engineering units: each channel's setup (scale, offset, invert, and a name
 * and unit of the user's) applied to the values read from the file, before anything is analysed or
 * stored. Setups for channels the file does not have are ignored; the file itself is never changed.
 */
export function inEngineeringUnits(channels: ParsedChannel[], setups: ChannelSetup[] = []): ParsedChannel[] {
  return channels.map((c, i) => {
    const s = setups.find((x) => x.index === i);
    if (!s) return c;
    return {
      ...c,
      name: s.name ?? c.name,
      unit: s.unit ?? c.unit,
      samples: isIdentityScaling(s) ? c.samples : applyChannelSetup(c.samples, s),
    };
  });
}
