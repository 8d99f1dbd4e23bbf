package io.github.cleave.segment;

import static org.junit.jupiter.api.Assertions.fail;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.file.Files;
import java.nio.file.Path;

/**
 * Open test images from Debian's {@code python3-skimage} 0.19.3 package (data files under CC0),
 * found in the folder named by the environment variable {@code CLEAVE_SKIMAGE_DATA} (the package's
 * {@code skimage/data} folder; {@code .ci/run} fetches it with {@code apt-get download} and {@code
 * dpkg -x}). Tests that need them are skipped where the folder is missing, and fail instead when
 * {@code CLEAVE_REQUIRE_DATA=1} is set, as in CI.
 */
final class ExternalData {
  private ExternalData() {}

  static Path skimageFile(String name) {
    String dir = System.getenv("CLEAVE_SKIMAGE_DATA");
    Path file = dir == null ? null : Path.of(dir, name);
    boolean present = file != null && Files.isRegularFile(file);
    if (!present && "1".equals(System.getenv("CLEAVE_REQUIRE_DATA"))) {
      fail(
          name
              + " from python3-skimage is missing: set CLEAVE_SKIMAGE_DATA to the package's"
              + " skimage/data folder (see .ci/run)");
    }
    assumeTrue(present, name + " from python3-skimage not available (CLEAVE_SKIMAGE_DATA)");
    return file;
  }
}
