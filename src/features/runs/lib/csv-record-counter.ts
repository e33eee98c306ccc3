/**
 * Counts the records of a CSV file as its bytes arrive, for the download's progress bar. A record
 * ends at a line feed outside quotes (RFC 4180, section 2): an address or a note may hold line breaks
 * of its own inside a quoted field, and those must not count. An escaped quote ("") toggles the
 * state twice, so it needs no special case; UTF-8 never uses the bytes of `"` or LF inside another
 * character, so the bytes can be read one by one across chunk boundaries.
 */
export class CsvRecordCounter {
  private inQuotes = false;
  /** Records ended so far (the header counts as one). */
  records = 0;

  push(chunk: Uint8Array): number {
    for (const byte of chunk) {
      if (byte === 34) this.inQuotes = !this.inQuotes;
      else if (byte === 10 && !this.inQuotes) this.records += 1;
    }
    return this.records;
  }
}
