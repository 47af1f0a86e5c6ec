// What a formatter hands the answer pipeline: a media type and the bytes, in chunks, in order.

export interface Product {
  readonly contentType: string;
  /** In order; an async iterable when part of the answer is written elsewhere (a worker thread) meanwhile. */
  readonly chunks: Iterable<string | Buffer> | AsyncIterable<string | Buffer>;
  /** Told once the answer has ended: delivered (its response finished on a socket) or not. */
  readonly settled?: (delivered: boolean) => void;
}
