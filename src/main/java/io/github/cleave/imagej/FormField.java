package io.github.cleave.imagej;

import ij.Macro;
import java.util.List;

/**
 * One field of a command's dialog. Its macro key is the first word of its label, lower-cased and
 * cut at a space or colon, exactly as ImageJ's recorder forms it ({@link Macro#trimKey}); the
 * labels of one dialog must give unique keys.
 *
 * @param label the label shown in the dialog
 * @param kind what sort of field it is
 * @param defaultValue the value used when neither the user nor a macro gives one ({@code "true"} or
 *     {@code "false"} for a checkbox)
 * @param choices the items of a choice field, empty for other kinds
 */
record FormField(String label, Kind kind, String defaultValue, List<String> choices) {
  /** The sort of a field. */
  enum Kind {
    /** Free text, also used for numbers (validated by the command, with its own messages). */
    TEXT,
    /** A path to a file, with a browse button in the dialog. */
    FILE,
    /** A path to a folder, with a browse button in the dialog. */
    FOLDER,
    /** One of {@link #choices}; a macro may give any text, so the command validates it. */
    CHOICE,
    /** On or off; a macro gives the bare key for on. */
    CHECK
  }

  FormField {
    choices = List.copyOf(choices);
  }

  static FormField text(String label, String defaultValue) {
    return new FormField(label, Kind.TEXT, defaultValue, List.of());
  }

  static FormField file(String label, String defaultValue) {
    return new FormField(label, Kind.FILE, defaultValue, List.of());
  }

  static FormField folder(String label, String defaultValue) {
    return new FormField(label, Kind.FOLDER, defaultValue, List.of());
  }

  static FormField choice(String label, String defaultValue, List<String> choices) {
    return new FormField(label, Kind.CHOICE, defaultValue, choices);
  }

  static FormField check(String label, boolean defaultValue) {
    return new FormField(label, Kind.CHECK, Boolean.toString(defaultValue), List.of());
  }

  /** The macro key: the recorder's key for this label. */
  String key() {
    return Macro.trimKey(label);
  }
}
