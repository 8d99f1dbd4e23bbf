package io.github.cleave.spark;

import io.github.cleave.image.BadInputException;
import java.nio.file.Path;
import java.util.List;
import java.util.regex.Pattern;
import picocli.CommandLine.Model.OptionSpec;
import picocli.CommandLine.ParseResult;

/**
 * The job's four paths as the user typed them, and its rule for them. A plain path (no scheme)
 * names a file system that every node mounts at the same path (a local disk for {@code local[*]};
 * NFS, Lustre, GPFS on a cluster); on a cluster (a master other than {@code local...}) it must be
 * absolute, since each executor would resolve a relative one against its own working folder. A URL
 * ({@code hdfs://...}, {@code s3a://...}, {@code file:/...}: any scheme for which Hadoop's {@code
 * FileSystem} has an implementation on the class path) is read and written through Hadoop's client;
 * if any of the four is a URL the run is staged ({@link StagedRun}), and its plain paths are taken
 * as {@code file:} URLs of the same mounted paths. Immutable.
 *
 * @param model the model option's text
 * @param in the input folder's text
 * @param out the output folder's text
 * @param seeds the seeds folder's text, or null
 */
record JobPaths(String model, String in, String out, String seeds) {
  /** A URL scheme of two or more characters (one letter would be a Windows drive). */
  private static final Pattern SCHEME = Pattern.compile("^[A-Za-z][A-Za-z0-9+.-]+:.*");

  /** The options' text as typed (a {@link Path} would fold the {@code //} of a URL). */
  static JobPaths of(ParseResult parsed) {
    return new JobPaths(
        text(parsed, "--model"),
        text(parsed, "--in"),
        text(parsed, "--out"),
        text(parsed, "--seeds"));
  }

  private static String text(ParseResult parsed, String option) {
    OptionSpec o = parsed.matchedOption(option);
    if (o == null) {
      return null;
    }
    List<String> values = o.stringValues();
    return values.isEmpty() ? null : values.get(values.size() - 1);
  }

  /** Whether a path's text is a URL (has a scheme). */
  static boolean isUrl(String path) {
    return path != null && SCHEME.matcher(path).matches();
  }

  /** Whether the run is staged: any of the paths is a URL. */
  boolean staged() {
    return isUrl(model) || isUrl(in) || isUrl(out) || isUrl(seeds);
  }

  /** Refuses relative plain paths when the master is not a local one. */
  void checkAbsolute(String master) {
    checkAbsolute("--model", model, master);
    checkAbsolute("--in", in, master);
    checkAbsolute("--out", out, master);
    checkAbsolute("--seeds", seeds, master);
  }

  /** Refuses a relative plain path when the master is not a local one. */
  static void checkAbsolute(String option, String path, String master) {
    if (path != null
        && !isUrl(path)
        && !master.startsWith("local")
        && !Path.of(path).isAbsolute()) {
      throw new BadInputException(
          option
              + " "
              + path
              + ": on a cluster ("
              + master
              + ") give an absolute path, the same on every node, or a URL such as hdfs://...; a"
              + " relative path would be read from each executor's own working folder");
    }
  }
}
