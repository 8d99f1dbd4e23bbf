package io.github.cleave.image;

import java.lang.invoke.MethodHandles;
import java.lang.invoke.VarHandle;
import java.nio.ByteOrder;

/**
 * Eight bytes of a {@code byte[]} (a mask, a label image) read as one {@code long}, at any index:
 * for passing over runs of zeros, or comparing eight voxels with their neighbours, eight at a time.
 * Stateless.
 */
public final class ByteWords {
  private static final VarHandle WORD =
      MethodHandles.byteArrayViewVarHandle(long[].class, ByteOrder.LITTLE_ENDIAN);

  private ByteWords() {}

  /** The bytes {@code a[i] .. a[i + 7]} as one word ({@code a[i]} the lowest byte). */
  public static long at(byte[] a, int i) {
    return (long) WORD.get(a, i);
  }

  /**
   * The first index in {@code [from, to)} whose byte is not 0, or {@code to} if there is none;
   * zeros are passed over eight at a time.
   */
  public static int nextNonZero(byte[] a, int from, int to) {
    int p = from;
    while (p + 8 <= to && at(a, p) == 0) {
      p += 8;
    }
    while (p < to && a[p] == 0) {
      p++;
    }
    return p;
  }
}
