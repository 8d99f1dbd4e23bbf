package io.github.cleave.cli;

/** Exit codes of the command line (DESIGN.md: 0, 2, 3, 130; 1 for a failed self-check). */
final class ExitCodes {
  private ExitCodes() {}

  /** Success. */
  static final int OK = 0;

  /** A check the user asked for failed (for instance {@code --check}): a bug in Cleave. */
  static final int CHECK_FAILED = 1;

  /** Bad arguments or unusable input; one line on standard error says what and what to do. */
  static final int BAD_INPUT = 2;

  /** A folder run in which some files failed. */
  static final int SOME_FILES_FAILED = 3;

  /** Interrupted (Ctrl-C); no partial files are left. */
  static final int INTERRUPTED = 130;
}
