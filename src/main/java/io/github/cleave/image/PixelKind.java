package io.github.cleave.image;

/** How an image's pixel values were stored: decides histogram ranges and output intensity types. */
public enum PixelKind {
  /** 8-bit unsigned grey, values 0..255. */
  GREY8,
  /** 16-bit unsigned grey, values 0..65535. */
  GREY16,
  /** 32-bit floating point grey. */
  FLOAT32,
  /** 24-bit colour as three 8-bit channels red, green, blue. */
  RGB;

  /** True for kinds whose values are whole numbers in a fixed range. */
  public boolean isInteger() {
    return this != FLOAT32;
  }
}
