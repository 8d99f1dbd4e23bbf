package io.github.cleave.io;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

/** SHA-256 checksums of files, as lower-case hex, for run records and model identity. */
public final class Checksums {
  private Checksums() {}

  /** The SHA-256 of the file's bytes. */
  public static String sha256(Path file) throws IOException {
    MessageDigest digest = newDigest();
    try (InputStream in = Files.newInputStream(file)) {
      byte[] buffer = new byte[1 << 16];
      for (int n; (n = in.read(buffer)) > 0; ) {
        digest.update(buffer, 0, n);
      }
    }
    return HexFormat.of().formatHex(digest.digest());
  }

  /** The SHA-256 of {@code bytes}: the same as that of a file holding them. */
  public static String sha256(byte[] bytes) {
    return HexFormat.of().formatHex(newDigest().digest(bytes));
  }

  private static MessageDigest newDigest() {
    try {
      return MessageDigest.getInstance("SHA-256");
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("every Java runtime has SHA-256", e);
    }
  }
}
