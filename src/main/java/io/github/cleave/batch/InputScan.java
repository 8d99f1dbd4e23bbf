package io.github.cleave.batch;

import io.github.cleave.image.BadInputException;
import java.io.IOException;
import java.nio.file.FileVisitResult;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.SimpleFileVisitor;
import java.nio.file.attribute.BasicFileAttributes;
import java.util.ArrayList;
import java.util.List;

/**
 * Finds the files of a folder run and checks the folders before anything is written.
 *
 * <p>A file is taken when it is a regular file, its name does not start with a dot (hidden files
 * and the {@code ._NAME} resource forks some file systems add), it is not a seed file ({@code
 * NAME.seeds.*}) or a reference mask of the samples ({@code NAME.truth.*}), and the pattern matches
 * its lower-cased name (or, for a pattern with {@code /}, its lower-cased path relative to the
 * input folder). With {@code recursive}, subfolders are searched too, except hidden ones and the
 * output folder. Files are sorted by relative path as strings, so the order, and with it every
 * folder output, is the same whatever the thread count.
 *
 * <p>Refused with a {@link BadInputException}, before any file is written: a missing input folder,
 * an output folder that is the input folder or a file, a missing seeds folder, an invalid pattern,
 * no matching file, and two inputs in one folder with the same name before the extension (their
 * outputs would have the same names).
 */
final class InputScan {
  private InputScan() {}

  /** One input of the run. */
  record InputFile(Path path, String relative, String folder, String baseName) {
    /**
     * The input at {@code relative} (with {@code /} between folders) below {@code in} (absolute and
     * normalised, as {@link #scan} uses it): the same value the scan makes for that file.
     */
    static InputFile of(Path in, String relative) {
      return new InputFile(
          in.resolve(relative),
          relative,
          InputNames.folderOf(relative),
          InputNames.baseOf(relative));
    }

    /** The folder of this file's outputs. */
    Path outDir(Path out) {
      return folder.isEmpty() ? out : out.resolve(folder);
    }

    /** The folder searched first for this file's seeds, or null. */
    Path seedsDir(Path seeds) {
      if (seeds == null) {
        return null;
      }
      return folder.isEmpty() ? seeds : seeds.resolve(folder);
    }
  }

  /** The input folder as the scan walks it: absolute and normalised. */
  static Path root(BatchSettings s) {
    return s.in().toAbsolutePath().normalize();
  }

  static List<InputFile> scan(BatchSettings s) throws IOException {
    Path in = root(s);
    Path out = s.out().toAbsolutePath().normalize();
    if (!Files.isDirectory(in)) {
      throw new BadInputException(
          "the input folder " + s.in() + " does not exist or is not a folder; give --in FOLDER");
    }
    if (Files.exists(out) && !Files.isDirectory(out)) {
      throw new BadInputException(
          "the output " + s.out() + " is a file, not a folder: give a folder for the results");
    }
    if (out.equals(in) || (Files.exists(out) && Files.isSameFile(out, in))) {
      throw new BadInputException(
          "the output folder "
              + s.out()
              + " is the input folder: choose another output folder so that inputs are never"
              + " overwritten");
    }
    if (s.seeds() != null && !Files.isDirectory(s.seeds())) {
      throw new BadInputException(
          "the seeds folder " + s.seeds() + " does not exist or is not a folder");
    }
    InputNames names = InputNames.of(s.pattern());
    List<InputFile> files = new ArrayList<>();
    Files.walkFileTree(
        in,
        new SimpleFileVisitor<>() {
          @Override
          public FileVisitResult preVisitDirectory(Path dir, BasicFileAttributes attrs) {
            if (dir.equals(in)) {
              return FileVisitResult.CONTINUE;
            }
            boolean skip =
                !s.recursive()
                    || !InputNames.searches(dir.getFileName().toString())
                    || dir.toAbsolutePath().normalize().equals(out);
            return skip ? FileVisitResult.SKIP_SUBTREE : FileVisitResult.CONTINUE;
          }

          @Override
          public FileVisitResult visitFile(Path file, BasicFileAttributes attrs) {
            if (!attrs.isRegularFile()) {
              return FileVisitResult.CONTINUE;
            }
            Path rel = in.relativize(file);
            String relative = rel.toString().replace(rel.getFileSystem().getSeparator(), "/");
            if (names.takes(file.getFileName().toString(), relative)) {
              files.add(InputFile.of(in, relative));
            }
            return FileVisitResult.CONTINUE;
          }

          @Override
          public FileVisitResult visitFileFailed(Path file, IOException e) {
            return FileVisitResult.CONTINUE; // an unreadable entry is not an input
          }
        });
    files.sort((a, b) -> a.relative().compareTo(b.relative()));
    List<String> relatives = new ArrayList<>(files.size());
    files.forEach(f -> relatives.add(f.relative()));
    names.check(relatives, s.in().toString(), s.recursive());
    return files;
  }
}
