package io.github.cleave.io;

/**
 * A DIMACS file that cannot be read as a max-flow problem. The message names the line and says what
 * was found and what was expected.
 */
public final class DimacsFormatException extends Exception {
  private static final long serialVersionUID = 1L;

  private final long line;

  /** A problem on {@code line} (1-based; 0 if it concerns the file as a whole). */
  public DimacsFormatException(long line, String message) {
    super(line > 0 ? "line " + line + ": " + message : message);
    this.line = line;
  }

  /** The 1-based line number, or 0 if the problem concerns the whole file. */
  public long line() {
    return line;
  }
}
