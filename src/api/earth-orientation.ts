// The Earth orientation a request is solved with: its explicit UT1 - UTC wins; otherwise the
// values come from the service's IERS table (EOP_FILE) where it covers the epoch, else 0.
import type { FrameOptions } from '../solver/earth/frames.js';

/** The frame options of a request (plain data: they travel to the worker threads). */
export function frameOptions(ut1MinusUtc: number | undefined): FrameOptions {
  return ut1MinusUtc !== undefined ? { dut1: ut1MinusUtc } : {};
}
