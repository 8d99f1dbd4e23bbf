package io.github.cleave.imagej;

import ij.Macro;
import ij.Prefs;
import ij.gui.GenericDialog;
import io.github.cleave.image.BadInputException;
import java.awt.GraphicsEnvironment;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.Consumer;

/**
 * Gathers a command's field values: from ImageJ's {@link GenericDialog} when there is a display
 * (which also reads macro options and feeds the recorder), or straight from the macro options with
 * {@link Macro#getValue} when there is none (a dialog cannot be built headless).
 *
 * <p>Remembered defaults ({@link Prefs}, keys {@code cleave.PREFIX.KEY}) are read and stored only
 * for interactive runs, when there are no macro options, so that a macro gives the same result
 * whatever was typed into a dialog before. A {@code validator} checks the values: in the dialog it
 * runs on every change and disables OK while a value is invalid; after the dialog (or for macro
 * options) an invalid value is a {@link BadInputException} whose message the command reports.
 */
final class Form {
  private final String title;
  private final String prefsPrefix;
  private final List<FormField> fields;

  /**
   * @throws IllegalArgumentException if two labels give the same macro key
   */
  Form(String title, String prefsPrefix, List<FormField> fields) {
    Set<String> keys = new HashSet<>();
    for (FormField f : fields) {
      if (!keys.add(f.key())) {
        throw new IllegalArgumentException("two fields of '" + title + "' have the key " + f.key());
      }
    }
    this.title = title;
    this.prefsPrefix = prefsPrefix;
    this.fields = List.copyOf(fields);
  }

  List<FormField> fields() {
    return fields;
  }

  /**
   * The values by macro key, or {@code null} if the user cancelled the dialog.
   *
   * @param message a line shown at the top of the dialog, or null
   * @param validator throws {@link BadInputException} for invalid values
   * @throws BadInputException if run headless without macro options, or a value is invalid
   */
  Map<String, String> read(String message, Consumer<Map<String, String>> validator) {
    String options = Macro.getOptions();
    Map<String, String> values;
    if (GraphicsEnvironment.isHeadless()) {
      if (options == null) {
        throw new BadInputException(
            title
                + " needs macro options when ImageJ runs without a display, for example "
                + example());
      }
      values = fromOptions(options);
    } else {
      values = fromDialog(message, options == null, validator);
      if (values == null) {
        return null;
      }
    }
    validator.accept(values);
    if (options == null) {
      for (Map.Entry<String, String> e : values.entrySet()) {
        Prefs.set(prefsKey(e.getKey()), e.getValue());
      }
    }
    return values;
  }

  /** The values the macro options give, defaults for keys they leave out. */
  Map<String, String> fromOptions(String options) {
    Map<String, String> values = new LinkedHashMap<>();
    String padded = " " + options.trim() + " ";
    for (FormField f : fields) {
      String key = f.key();
      String v;
      if (f.kind() == FormField.Kind.CHECK) {
        v = Boolean.toString(padded.contains(" " + key + " "));
      } else {
        v = Macro.getValue(options, key, f.defaultValue());
      }
      values.put(key, v == null ? "" : v.trim());
    }
    return values;
  }

  private Map<String, String> fromDialog(
      String message, boolean remembered, Consumer<Map<String, String>> validator) {
    GenericDialog gd = new GenericDialog(title);
    if (message != null) {
      gd.addMessage(message);
    }
    for (FormField f : fields) {
      String initial =
          remembered ? Prefs.get(prefsKey(f.key()), f.defaultValue()) : f.defaultValue();
      switch (f.kind()) {
        case TEXT -> gd.addStringField(f.label(), initial, 12);
        case FILE -> gd.addFileField(f.label(), initial, 30);
        case FOLDER -> gd.addDirectoryField(f.label(), initial, 30);
        case CHOICE -> {
          String[] items = f.choices().toArray(new String[0]);
          gd.addChoice(f.label(), items, f.choices().contains(initial) ? initial : items[0]);
        }
        case CHECK -> gd.addCheckbox(f.label(), Boolean.parseBoolean(initial));
      }
    }
    gd.addDialogListener(
        (dialog, event) -> {
          try {
            validator.accept(collect(dialog));
            return true;
          } catch (BadInputException e) {
            ij.IJ.showStatus(e.getMessage());
            return false;
          }
        });
    gd.showDialog();
    if (gd.wasCanceled()) {
      return null;
    }
    return collect(gd);
  }

  private Map<String, String> collect(GenericDialog gd) {
    Map<String, String> values = new LinkedHashMap<>();
    for (FormField f : fields) {
      String v =
          switch (f.kind()) {
            case TEXT, FILE, FOLDER -> gd.getNextString();
            case CHOICE -> gd.getNextChoice();
            case CHECK -> Boolean.toString(gd.getNextBoolean());
          };
      values.put(f.key(), v == null ? "" : v.trim());
    }
    return values;
  }

  /** A macro option string with every default, for messages. */
  String example() {
    StringBuilder sb = new StringBuilder();
    for (FormField f : fields) {
      if (f.kind() == FormField.Kind.CHECK) {
        continue;
      }
      String v = f.defaultValue();
      if (v.isEmpty()) {
        continue;
      }
      sb.append(sb.length() == 0 ? "" : " ").append(f.key()).append('=');
      sb.append(v.contains(" ") ? "[" + v + "]" : v);
    }
    return "\"" + sb + "\"";
  }

  private String prefsKey(String key) {
    return "cleave." + prefsPrefix + "." + key;
  }
}
