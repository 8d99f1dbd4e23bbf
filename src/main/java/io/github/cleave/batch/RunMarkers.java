package io.github.cleave.batch;

import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import io.github.cleave.image.BadInputException;
import io.github.cleave.render.DisplayRange;
import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.channels.OverlappingFileLockException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.regex.Pattern;
import java.util.stream.Stream;

/**
 * The run-level files of an output folder besides the folder tables: {@code run.started.json},
 * written atomically before the first image, saying which model the folder belongs to and which
 * display ranges its pictures use (so that a run stopped at any point, even by SIGKILL, resumes
 * with the same ranges and refuses another model); a lock file that keeps two runs out of one
 * folder; and the removal of hidden temporary files a killed run left behind.
 */
final class RunMarkers {
  static final String STARTED = "run.started.json";
  static final String RUN = "run.json";
  static final String LOCK = ".cleave-batch.lock";

  /** Temporary files of {@code io.AtomicFiles}: {@code .NAME.HEX.part}. */
  private static final Pattern PART = Pattern.compile("^\\..+\\.[0-9a-f]{1,16}\\.part$");

  private RunMarkers() {}

  /** What {@code run.started.json} says: the model's SHA-256 and the display ranges (or null). */
  record Started(String modelSha256, DisplayRange[] ranges) {}

  static Optional<Started> readStarted(Path out) {
    Path file = out.resolve(STARTED);
    if (!Files.isRegularFile(file)) {
      return Optional.empty();
    }
    try {
      JsonObject o = JsonParser.parseString(Files.readString(file)).getAsJsonObject();
      String sha = o.get("modelSha256").getAsString();
      DisplayRange[] ranges = null;
      JsonElement r = o.get("displayRanges");
      if (r != null && r.isJsonArray()) {
        JsonArray a = r.getAsJsonArray();
        ranges = new DisplayRange[a.size()];
        for (int i = 0; i < ranges.length; i++) {
          JsonObject e = a.get(i).getAsJsonObject();
          ranges[i] = new DisplayRange(e.get("min").getAsDouble(), e.get("max").getAsDouble());
        }
      }
      return Optional.of(new Started(sha, ranges));
    } catch (IOException | RuntimeException e) {
      throw new BadInputException(
          "the output folder holds an unreadable "
              + file
              + " ("
              + e.getMessage()
              + "); delete it, or give another output folder");
    }
  }

  static JsonArray rangesToJson(DisplayRange[] ranges) {
    if (ranges == null) {
      return null;
    }
    JsonArray a = new JsonArray();
    for (DisplayRange r : ranges) {
      JsonObject e = new JsonObject();
      e.addProperty("min", r.min());
      e.addProperty("max", r.max());
      a.add(e);
    }
    return a;
  }

  /** Holds the folder's lock until closed; refuses a folder another run is writing to. */
  static AutoCloseable lock(Path out) throws IOException {
    Path file = out.resolve(LOCK);
    FileChannel channel =
        FileChannel.open(file, StandardOpenOption.CREATE, StandardOpenOption.WRITE);
    FileLock lock;
    try {
      lock = channel.tryLock();
    } catch (OverlappingFileLockException e) {
      lock = null;
    }
    if (lock == null) {
      channel.close();
      throw new BadInputException(
          "another run is writing to the output folder "
              + out
              + "; wait for it to finish or give another output folder");
    }
    FileLock held = lock;
    return () -> {
      try {
        Files.deleteIfExists(file);
      } finally {
        held.release();
        channel.close();
      }
    };
  }

  static boolean isPart(String name) {
    return PART.matcher(name).matches();
  }

  /** Deletes the hidden temporary files an interrupted run left in {@code out} and below. */
  static int removeLeftoverParts(Path out) throws IOException {
    List<Path> parts = new ArrayList<>();
    try (Stream<Path> all = Files.walk(out)) {
      all.filter(p -> isPart(p.getFileName().toString()))
          .filter(Files::isRegularFile)
          .forEach(parts::add);
    }
    for (Path p : parts) {
      Files.deleteIfExists(p);
    }
    return parts.size();
  }

  static byte[] utf8(String s) {
    return s.getBytes(StandardCharsets.UTF_8);
  }
}
