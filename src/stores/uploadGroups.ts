/** One upload: a file, or a COMTRADE .cfg with its .dat; or a file held back, with why. */
export interface UploadGroup<F extends { name: string }> {
  file: F;
  data?: F;
  /** Set when the file is not sent (a .cfg without its .dat). */
  refused?: string;
  /** Shown beside an upload that goes ahead. */
  note?: string;
}

const split = (name: string) => {
  const dot = name.lastIndexOf('.');
  return dot > 0 ? { base: name.slice(0, dot).toLowerCase(), ext: name.slice(dot + 1).toLowerCase() } : { base: name.toLowerCase(), ext: '' };
};

/**
 * Groups dropped or picked files into uploads: a COMTRADE .cfg and the .dat of the same base name go
 * together (their .hdr and .inf are left out: Crestline does not read them). A .cfg alone is held back
 * with a message; a .dat alone goes up as a text export, since loggers also name their CSVs .dat.
 */
export function uploadGroups<F extends { name: string }>(files: F[]): UploadGroup<F>[] {
  const byBase = new Map<string, Map<string, F>>();
  for (const f of files) {
    const { base, ext } = split(f.name);
    if (!byBase.has(base)) byBase.set(base, new Map());
    byBase.get(base)!.set(ext, f);
  }
  const out: UploadGroup<F>[] = [];
  for (const f of files) {
    const { base, ext } = split(f.name);
    const group = byBase.get(base)!;
    const cfg = group.get('cfg');
    const dat = group.get('dat');
    if (ext === 'cfg') {
      if (dat) out.push({ file: f, data: dat });
      else out.push({ file: f, refused: `${f.name} is a COMTRADE configuration: drop it together with its .dat (same name).` });
    } else if (ext === 'dat') {
      if (!cfg) out.push({ file: f, note: 'No .cfg beside it: read as a text export. For a COMTRADE record, drop its .cfg and .dat together.' });
    } else if (!((ext === 'hdr' || ext === 'inf') && cfg)) {
      out.push({ file: f });
    }
  }
  return out;
}
