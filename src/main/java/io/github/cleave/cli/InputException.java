package io.github.cleave.cli;

/**
 * Unusable input found by a command: a missing or malformed file, a file that does not fit the
 * options. The message is one line saying what was wrong and what to do; the command line prints it
 * and exits with {@link ExitCodes#BAD_INPUT}.
 */
final class InputException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  InputException(String message) {
    super(message);
  }
}
