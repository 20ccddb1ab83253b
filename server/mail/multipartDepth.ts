/**
 * How deeply the multipart bodies of a raw MIME message nest, found in one pass over its lines without
 * parsing it, so that a message built to make a parser recurse thousands of levels deep is refused
 * before any parser sees it. A header block whose Content-Type is multipart with a boundary opens a
 * level; a delimiter line of a boundary already open closes the levels inside it (`--b--` closes b
 * too). Counting stops once the depth passes `limit`. Each boundary is pushed and popped once and
 * looked up in a Map, so the cost stays linear in the message's length however deep it nests.
 */
export function multipartDepth(raw: string, limit: number): number {
  const open: string[] = [];
  const levelOf = new Map<string, number>();
  const closeTo = (level: number) => {
    while (open.length > level) levelOf.delete(open.pop() as string);
  };
  let deepest = 0;
  let inHeaders = true;
  let contentType: string | null = null;
  let inContentType = false;
  for (let start = 0; start < raw.length; ) {
    const nl = raw.indexOf('\n', start);
    const end = nl < 0 ? raw.length : nl;
    const line = raw.slice(start, raw[end - 1] === '\r' ? end - 1 : end);
    start = end + 1;
    if (inHeaders) {
      if (line === '') {
        const boundary = contentType === null ? null : multipartBoundary(contentType);
        if (boundary !== null) {
          levelOf.set(boundary, open.length);
          open.push(boundary);
          deepest = Math.max(deepest, open.length);
          if (deepest > limit) return deepest;
        }
        inHeaders = false;
        contentType = null;
        inContentType = false;
      } else if (line[0] === ' ' || line[0] === '\t') {
        if (inContentType) contentType += line;
      } else {
        inContentType = line.slice(0, 13).toLowerCase() === 'content-type:';
        if (inContentType) contentType = line.slice(13);
      }
    } else if (line.startsWith('--')) {
      const mark = line.slice(2).trimEnd();
      const level = levelOf.get(mark);
      const closing = level === undefined && mark.endsWith('--') ? levelOf.get(mark.slice(0, -2)) : undefined;
      if (level !== undefined) {
        // A new part of that multipart: the levels opened inside its previous part end here.
        closeTo(level + 1);
        inHeaders = true;
      } else if (closing !== undefined) {
        closeTo(closing);
      }
    }
  }
  return deepest;
}

/** The boundary of a multipart Content-Type value, or null for any other type. */
function multipartBoundary(value: string): string | null {
  const lower = value.toLowerCase();
  if (!lower.trimStart().startsWith('multipart/')) return null;
  const at = lower.indexOf('boundary=');
  if (at < 0) return null;
  let from = at + 'boundary='.length;
  let to: number;
  if (value[from] === '"') {
    from++;
    to = value.indexOf('"', from);
    if (to < 0) to = value.length;
  } else {
    to = from;
    while (to < value.length && value[to] !== ';' && value[to] !== ' ' && value[to] !== '\t') to++;
  }
  return value.slice(from, to) || null;
}
