// An item's product inside a batch or job line. A JSON answer is spliced into the line as
// `"answer":<bytes>` (as it always was); a GeoJSON answer likewise, with its `mediaType`; a text
// product (CSV, CCSDS OEM, SVG) is carried as a JSON string `"product"` with its `mediaType`.
// `answer`/`product` is always the last member of a line, so the bytes can be cut out again
// without re-serialising them: GET /v1/jobs/{id}/results/{index} and the archive serve them as the
// endpoint answered them.
import { JSON_MEDIA_TYPE } from '../formats/track-json.js';

/** What a line carries for a 200 item: the media type and the product's exact bytes. */
export interface ItemProduct {
  /** The item's format (json when the request named none). */
  readonly format: string;
  readonly mediaType: string;
  readonly bytes: Buffer;
}

/** JSON-family media types (application/json, application/geo+json, ...) are spliced as JSON. */
export const isJsonMediaType = (mediaType: string): boolean => /^application\/([a-z0-9.+-]*\+)?json\b/i.test(mediaType);

/**
 * The tail of a 200 line after its head: for a format other than JSON its `format` and `mediaType`,
 * then the answer or product. `format` is the item's request.format (undefined: JSON).
 */
export function productTail(format: string | undefined, mediaType: string, body: Buffer): Buffer {
  if (format === undefined || format === 'json') return Buffer.concat([Buffer.from(',"answer":'), body]);
  const type = `,"format":${JSON.stringify(format)},"mediaType":${JSON.stringify(mediaType)}`;
  if (isJsonMediaType(mediaType)) return Buffer.concat([Buffer.from(`${type},"answer":`), body]);
  return Buffer.from(`${type},"product":${JSON.stringify(body.toString('utf8'))}`);
}

// Inside a JSON string every `"` is escaped, so the first `,"answer":` / `,"product":` of a line is its member.
const ANSWER_KEY = Buffer.from(',"answer":');
const PRODUCT_KEY = Buffer.from(',"product":');
const MEDIA_KEY = Buffer.from(',"mediaType":');
const FORMAT_KEY = Buffer.from(',"format":');

/** The string value of a member known to hold no quote or backslash (format names, media types). */
function plainMember(line: Buffer, key: Buffer): string | undefined {
  const at = line.indexOf(key);
  if (at < 0) return undefined;
  const start = at + key.length + 1;
  return line.subarray(start, line.indexOf(0x22, start)).toString('utf8');
}

const PROBLEM_KEY = Buffer.from(',"problem":');

/** The product of a stored line (ending with "}\n" or "}"); undefined for a problem line. */
export function lineProduct(line: Buffer): ItemProduct | undefined {
  const end = line[line.length - 1] === 0x0a ? line.length - 2 : line.length - 1; // the closing brace
  // The head (index, id, kind, status, scenarioHash, format, mediaType) holds only numbers, a hex
  // hash and escaped strings, so the first of these keys is the line's own member.
  const members = [ANSWER_KEY, PRODUCT_KEY, PROBLEM_KEY]
    .map((key) => ({ key, at: line.indexOf(key) }))
    .filter((m) => m.at >= 0)
    .sort((a, b) => a.at - b.at);
  const first = members[0];
  if (!first || first.key === PROBLEM_KEY) return undefined;
  const head = line.subarray(0, first.at);
  const mediaType = plainMember(head, MEDIA_KEY) ?? JSON_MEDIA_TYPE;
  const format = plainMember(head, FORMAT_KEY) ?? 'json';
  const value = line.subarray(first.at + first.key.length, end);
  if (first.key === ANSWER_KEY) return { format, mediaType, bytes: value };
  return { format, mediaType, bytes: Buffer.from(JSON.parse(value.toString('utf8')) as string, 'utf8') };
}

/** File name extension of a product in the archive: the format's name (geojson, csv, oem, svg, json). */
export const productExtension = (format: string): string => (/^[a-z0-9]{1,10}$/.test(format) ? format : 'bin');
