package io.github.cleave.batch;

import io.github.cleave.io.AtomicFiles;
import io.github.cleave.io.ImageOutputs;
import io.github.cleave.render.ContactSheet;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The folder-level tables and picture of a run, each written atomically, rows in the run's file
 * order so that they are the same bytes whatever the thread count:
 *
 * <ul>
 *   <li>{@code objects.csv}: the rows of every segmented file's {@code NAME.objects.csv}, read back
 *       from disk (so kept and new files are treated alike), each prefixed with a {@code file}
 *       column (the relative path); the header is the first segmented file's. A file whose table
 *       has other columns (another channel count, a stack among planes, another unit) is left out,
 *       with a note in its {@code files.csv} row.
 *   <li>{@code files.csv}: {@code file,status,objects,time_ms,message}, one row per file; {@code
 *       status} is {@code ok} or {@code failed}, {@code objects} empty for a failed file, {@code
 *       time_ms} the segmentation time (the only column that differs between reruns).
 *   <li>{@code contact-sheet.png}: the first {@link #SHEET_FILES} files in order (thumbnails with
 *       contours, failures marked) and then up to {@link #SHEET_EXTRA_FAILURES} further failures;
 *       up to {@link #MAX_COLUMNS} columns, so the sheet stays under 4000 pixels wide.
 * </ul>
 */
final class FolderOutputs {
  static final String FILES_CSV = "files.csv";
  static final String OBJECTS_CSV = "objects.csv";
  static final String SHEET = "contact-sheet.png";

  /** Files shown on the contact sheet before only failures are added. */
  static final int SHEET_FILES = 400;

  /** Failures shown beyond the first {@link #SHEET_FILES} files. */
  static final int SHEET_EXTRA_FAILURES = 200;

  /** Widest sheet: 18 tiles of 192 + 10 pixels, about 3650 pixels. */
  static final int MAX_COLUMNS = 18;

  private FolderOutputs() {}

  /**
   * Writes {@code objects.csv}; returns the outcomes with a note on files left out of it.
   *
   * @param outDirs the output folder of each file, in the same order
   */
  static List<FileOutcome> writeObjects(Path out, List<FileOutcome> files, List<Path> outDirs)
      throws IOException {
    List<FileOutcome> noted = new ArrayList<>(files);
    StringBuilder sb = new StringBuilder();
    String header = null;
    for (int i = 0; i < files.size(); i++) {
      FileOutcome f = files.get(i);
      if (f.failed()) {
        continue;
      }
      Path table = outDirs.get(i).resolve(baseName(f.file()) + ".objects.csv");
      List<String> lines = Files.readAllLines(table, StandardCharsets.UTF_8);
      if (lines.isEmpty()) {
        continue;
      }
      if (header == null) {
        header = lines.get(0);
        sb.append("file,").append(header).append('\n');
      } else if (!header.equals(lines.get(0))) {
        noted.set(
            i,
            f.withMessage(
                "objects not in objects.csv: their columns differ from the first file's; see "
                    + baseName(f.file())
                    + ".objects.csv"));
        continue;
      }
      String prefix = csv(f.file()) + ",";
      for (int k = 1; k < lines.size(); k++) {
        if (!lines.get(k).isEmpty()) {
          sb.append(prefix).append(lines.get(k)).append('\n');
        }
      }
    }
    if (header == null) {
      sb.append("file,object\n");
    }
    byte[] bytes = sb.toString().getBytes(StandardCharsets.UTF_8);
    AtomicFiles.write(out.resolve(OBJECTS_CSV), o -> o.write(bytes));
    return noted;
  }

  static void writeFiles(Path out, List<FileOutcome> files) throws IOException {
    StringBuilder sb = new StringBuilder("file,status,objects,time_ms,message\n");
    for (FileOutcome f : files) {
      sb.append(csv(f.file())).append(',');
      sb.append(f.failed() ? "failed" : "ok").append(',');
      sb.append(f.failed() ? "" : Integer.toString(f.objectCount())).append(',');
      sb.append(String.format(Locale.ROOT, "%.1f", f.timeMs())).append(',');
      sb.append(csv(f.message())).append('\n');
    }
    byte[] bytes = sb.toString().getBytes(StandardCharsets.UTF_8);
    AtomicFiles.write(out.resolve(FILES_CSV), o -> o.write(bytes));
  }

  /**
   * Writes the contact sheet; returns a note when files were left off it, else null.
   *
   * @param thumbnails one per file, null where there is none
   */
  static String writeSheet(Path out, List<FileOutcome> files, List<BufferedImage> thumbnails)
      throws IOException {
    List<ContactSheet.Tile> tiles = new ArrayList<>();
    int failuresAdded = 0;
    int failuresLeft = 0;
    for (int i = 0; i < files.size(); i++) {
      FileOutcome f = files.get(i);
      if (i < SHEET_FILES) {
        tiles.add(tile(f, thumbnails.get(i)));
      } else if (f.failed() && failuresAdded < SHEET_EXTRA_FAILURES) {
        tiles.add(tile(f, null));
        failuresAdded++;
      } else if (f.failed()) {
        failuresLeft++;
      }
    }
    int columns =
        Math.min(
            MAX_COLUMNS,
            Math.max(ContactSheet.DEFAULT_COLUMNS, (int) Math.ceil(Math.sqrt(tiles.size()))));
    ImageOutputs.writePng(out.resolve(SHEET), ContactSheet.render(tiles, columns));
    if (files.size() <= SHEET_FILES) {
      return null;
    }
    return String.format(
        Locale.ROOT,
        "the contact sheet shows the first %d of %d files and %d later failure(s)%s; every file"
            + " has its own NAME.overlay.png",
        SHEET_FILES,
        files.size(),
        failuresAdded,
        failuresLeft > 0 ? " (" + failuresLeft + " more failures are only in files.csv)" : "");
  }

  private static ContactSheet.Tile tile(FileOutcome f, BufferedImage thumbnail) {
    return f.failed()
        ? ContactSheet.Tile.failed(f.file(), f.message())
        : ContactSheet.Tile.done(f.file(), thumbnail, f.objectCount());
  }

  /** The output name stem of a relative input path. */
  static String baseName(String relative) {
    String name = relative.substring(relative.lastIndexOf('/') + 1);
    int dot = name.lastIndexOf('.');
    return dot > 0 ? name.substring(0, dot) : name;
  }

  /** A CSV field, quoted when it holds a comma, quote or line break (RFC 4180). */
  static String csv(String s) {
    if (s.indexOf(',') < 0 && s.indexOf('"') < 0 && s.indexOf('\n') < 0 && s.indexOf('\r') < 0) {
      return s;
    }
    return '"' + s.replace("\"", "\"\"") + '"';
  }
}
