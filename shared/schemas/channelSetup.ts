import { z } from 'zod';

/** The units a channel may be given: a closed list, so a typo cannot pass for a unit ('' for none). */
export const CHANNEL_UNITS = ['V', 'mV', 'kV', 'A', 'mA', 'kA', 'W', 'kW', 'VA', 'var', 'Ω', 'Hz', '°C', '%', ''] as const;
export const ChannelUnit = z.enum(CHANNEL_UNITS, { message: `Choose a unit from ${CHANNEL_UNITS.filter(Boolean).join(', ')} or none` });
export type ChannelUnit = z.infer<typeof ChannelUnit>;

/** Scale factors beyond these are typing errors, not probes (a 1 µΩ shunt is 10⁶, a 1:10⁵ divider 10⁵). */
export const MAX_SCALE = 1e9;
export const MIN_SCALE = 1e-9;

/** A multiplier from the recorded value to the engineering unit: finite, not zero, within sane limits. */
export const Scale = z
  .number({ message: 'Scale must be a finite number' })
  .refine((s) => Number.isFinite(s), 'Scale must be a finite number')
  .refine((s) => s !== 0, 'Scale must not be zero')
  .refine((s) => Math.abs(s) <= MAX_SCALE && Math.abs(s) >= MIN_SCALE, `Scale must lie between ${MIN_SCALE} and ${MAX_SCALE} in size`);

export const Offset = z
  .number({ message: 'Offset must be a finite number' })
  .refine((s) => Number.isFinite(s) && Math.abs(s) <= 1e12, 'Offset must be a finite number below 10¹² in size');

export const ChannelName = z.string().trim().min(1, 'Give the channel a name').max(120, 'A channel name has at most 120 characters');

/** The body of PATCH /api/captures/:id/channels/:index: any of the fields, at least one. */
export const ChannelSetupPatch = z
  .object({ name: ChannelName.optional(), unit: ChannelUnit.optional(), scale: Scale.optional(), offset: Offset.optional(), invert: z.boolean().optional() })
  .strict()
  .refine((v) => Object.keys(v).length > 0, 'Nothing to change');
export type ChannelSetupPatch = z.infer<typeof ChannelSetupPatch>;

/**
 * How one channel is turned into engineering units: value = (invert ? −1 : 1) · scale · recorded + offset,
 * the offset in the new unit. Name and unit replace the file's when set.
 */
export const ChannelSetup = z.object({
  index: z.number().int().min(0).max(255),
  name: ChannelName.optional(),
  unit: ChannelUnit.optional(),
  scale: Scale,
  offset: Offset,
  invert: z.boolean(),
});
export type ChannelSetup = z.infer<typeof ChannelSetup>;

/** The setups sent with an upload (form field `channelSetup`, JSON): as the PATCH body, with the channel's index. */
export const UploadChannelSetup = z
  .array(z.object({ index: z.number().int().min(0).max(255), name: ChannelName.optional(), unit: ChannelUnit.optional(), scale: Scale.optional(), offset: Offset.optional(), invert: z.boolean().optional() }).strict())
  .max(64);
export type UploadChannelSetup = z.infer<typeof UploadChannelSetup>;

/** A named probe or clamp of a project, e.g. "clamp 100 mV/A → A", applied to a channel in one click. */
export const ProbePreset = z.object({
  id: z.number().int(),
  projectId: z.number().int(),
  name: z.string(),
  unit: ChannelUnit,
  scale: z.number(),
  offset: z.number(),
  invert: z.boolean(),
  createdBy: z.number().int().nullable(),
});
export type ProbePreset = z.infer<typeof ProbePreset>;

export const CreateProbePresetRequest = z
  .object({
    name: z.string().trim().min(1, 'Give the preset a name').max(80, 'A preset name has at most 80 characters'),
    unit: ChannelUnit,
    scale: Scale,
    offset: Offset.default(0),
    invert: z.boolean().default(false),
  })
  .strict();
export type CreateProbePresetRequest = z.infer<typeof CreateProbePresetRequest>;

/** A setup with the defaults filled in: scale 1, offset 0, not inverted. */
export const completeSetup = (index: number, s: Partial<Omit<ChannelSetup, 'index'>>): ChannelSetup => ({
  index,
  ...(s.name !== undefined ? { name: s.name } : {}),
  ...(s.unit !== undefined ? { unit: s.unit } : {}),
  scale: s.scale ?? 1,
  offset: s.offset ?? 0,
  invert: s.invert ?? false,
});

/** The upload form field: JSON text of UploadChannelSetup, read into complete setups. */
export const UploadChannelSetupField = z
  .string()
  .max(20_000)
  .transform((text, ctx) => {
    try {
      return JSON.parse(text) as unknown;
    } catch {
      ctx.addIssue({ code: 'custom', message: 'channelSetup is not valid JSON' });
      return z.NEVER;
    }
  })
  .pipe(UploadChannelSetup)
  .transform((list) => list.map(({ index, ...s }) => completeSetup(index, s)));
