// A small reader of CCSDS OEM messages in KVN (CCSDS 502.0-B-3, sec. 5; from memory), written for
// the tests and independent of src/formats/oem.ts: header keywords, metadata blocks between
// META_START and META_STOP, and ephemeris data lines "epoch x y z x_dot y_dot z_dot".

export interface OemSegment {
  meta: Record<string, string>;
  metaOrder: string[];
  epochs: string[];
  /** 6 numbers per data line, in file order. */
  states: number[];
}

export interface ParsedOem {
  header: Record<string, string>;
  headerOrder: string[];
  comments: string[];
  segments: OemSegment[];
}

const KEY_VALUE = /^([A-Z0-9_]+)\s*=\s*(.*\S)\s*$/;

/** Parses a KVN OEM; throws with the line number on anything it does not understand. */
export function parseOemKvn(text: string): ParsedOem {
  const out: ParsedOem = { header: {}, headerOrder: [], comments: [], segments: [] };
  let segment: OemSegment | null = null;
  let inMeta = false;
  const lines = text.split(/\r\n|\n|\r/);
  lines.forEach((raw, index) => {
    const line = raw.trim();
    const where = `line ${index + 1}`;
    if (line === '') return;
    if (line.startsWith('COMMENT')) {
      out.comments.push(line.slice(7).trim());
      return;
    }
    if (line === 'META_START') {
      segment = { meta: {}, metaOrder: [], epochs: [], states: [] };
      out.segments.push(segment);
      inMeta = true;
      return;
    }
    if (line === 'META_STOP') {
      if (!inMeta) throw new Error(`${where}: META_STOP without META_START`);
      inMeta = false;
      return;
    }
    const kv = KEY_VALUE.exec(line);
    if (kv && (inMeta || segment === null)) {
      const target = inMeta ? segment!.meta : out.header;
      const order = inMeta ? segment!.metaOrder : out.headerOrder;
      if (kv[1]! in target) throw new Error(`${where}: ${kv[1]} repeated`);
      target[kv[1]!] = kv[2]!;
      order.push(kv[1]!);
      return;
    }
    if (segment === null || inMeta) throw new Error(`${where}: unexpected "${line}"`);
    const fields = line.split(/\s+/);
    if (fields.length !== 7) throw new Error(`${where}: a data line needs 7 fields, got ${fields.length}`);
    (segment as OemSegment).epochs.push(fields[0]!);
    for (const f of fields.slice(1)) {
      const value = Number(f);
      if (!Number.isFinite(value)) throw new Error(`${where}: "${f}" is not a number`);
      (segment as OemSegment).states.push(value);
    }
  });
  if (inMeta) throw new Error('metadata block not closed');
  return out;
}
