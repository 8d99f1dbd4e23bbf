package io.github.cleave.io;

import java.io.IOException;
import java.io.InputStream;
import java.util.Arrays;

/**
 * Splits a byte stream into lines and lines into whitespace-separated tokens without creating
 * objects per line: a hand-written tokenizer fast enough for files of tens of millions of lines.
 * ASCII only; lines end with LF (a CR before it is whitespace). Not thread-safe.
 */
final class LineReader {
  private final InputStream in;
  private final byte[] buffer = new byte[1 << 16];
  private int bufferPos;
  private int bufferEnd;
  private byte[] line = new byte[256];
  private int length; // bytes of the current line
  private int pos; // read position within the current line
  private long lineNumber;

  LineReader(InputStream in) {
    this.in = in;
  }

  /** Advances to the next line; false at the end of the stream. */
  boolean next() throws IOException {
    length = 0;
    pos = 0;
    boolean any = false;
    while (true) {
      if (bufferPos == bufferEnd) {
        bufferEnd = in.read(buffer, 0, buffer.length);
        bufferPos = 0;
        if (bufferEnd <= 0) {
          bufferEnd = 0;
          if (any) {
            lineNumber++;
          }
          return any;
        }
      }
      any = true;
      int start = bufferPos;
      int end = bufferEnd;
      int i = start;
      while (i < end && buffer[i] != '\n') {
        i++;
      }
      append(start, i - start);
      if (i < end) {
        bufferPos = i + 1;
        lineNumber++;
        return true;
      }
      bufferPos = end;
    }
  }

  private void append(int from, int count) {
    if (length + count > line.length) {
      line = Arrays.copyOf(line, Math.max(2 * line.length, length + count));
    }
    System.arraycopy(buffer, from, line, length, count);
    length += count;
  }

  long lineNumber() {
    return lineNumber;
  }

  /** Skips whitespace; true if a token follows on this line. */
  boolean hasToken() {
    while (pos < length && isSpace(line[pos])) {
      pos++;
    }
    return pos < length;
  }

  /** The next token as text (for messages and words such as {@code max}, {@code s}). */
  String word() {
    hasToken();
    int start = pos;
    while (pos < length && !isSpace(line[pos])) {
      pos++;
    }
    return new String(line, start, pos - start, java.nio.charset.StandardCharsets.US_ASCII);
  }

  /** The first non-blank byte of the line, or 0 for a blank line; does not move. */
  byte firstByte() {
    int i = 0;
    while (i < length && isSpace(line[i])) {
      i++;
    }
    return i < length ? line[i] : 0;
  }

  /**
   * Parses the next token as a decimal integer (optionally signed).
   *
   * @return the value, or {@code Long.MIN_VALUE} if there is no token or it is not an integer that
   *     fits in 18 digits
   */
  long number() {
    if (!hasToken()) {
      return Long.MIN_VALUE;
    }
    boolean negative = false;
    if (line[pos] == '-' || line[pos] == '+') {
      negative = line[pos] == '-';
      pos++;
    }
    long value = 0;
    int digits = 0;
    while (pos < length && !isSpace(line[pos])) {
      int d = line[pos] - '0';
      if (d < 0 || d > 9 || digits == 18) {
        while (pos < length && !isSpace(line[pos])) {
          pos++;
        }
        return Long.MIN_VALUE;
      }
      value = value * 10 + d;
      digits++;
      pos++;
    }
    if (digits == 0) {
      return Long.MIN_VALUE;
    }
    return negative ? -value : value;
  }

  /** The whole line as text, shortened, for messages. */
  String text() {
    int n = Math.min(length, 60);
    String s = new String(line, 0, n, java.nio.charset.StandardCharsets.US_ASCII).strip();
    return length > 60 ? s + "..." : s;
  }

  private static boolean isSpace(byte b) {
    return b == ' ' || b == '\t' || b == '\r' || b == '\f';
  }
}
