// What a formatter hands the answer pipeline: a media type and the bytes, in chunks, in order.

export interface Product {
  readonly contentType: string;
  readonly chunks: Iterable<string | Buffer>;
}
