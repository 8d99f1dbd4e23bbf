package io.github.cleave.image;

/**
 * Unusable input found while segmenting: seeds missing for a class, a seed image of the wrong size,
 * a model that does not fit the image, a corrupt file. The message is one line that says what was
 * wrong and what to do; the command line prints it and exits with code 2, the ImageJ plugin shows
 * it as an error.
 */
public class BadInputException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  public BadInputException(String message) {
    super(message);
  }

  public BadInputException(String message, Throwable cause) {
    super(message, cause);
  }
}
