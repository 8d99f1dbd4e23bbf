package io.github.cleave.imagej;

import ij.IJ;
import io.github.cleave.model.ModelKind;
import java.awt.Button;
import java.awt.Checkbox;
import java.awt.Choice;
import java.awt.EventQueue;
import java.awt.Frame;
import java.awt.GridBagConstraints;
import java.awt.GridBagLayout;
import java.awt.GridLayout;
import java.awt.Label;
import java.awt.Panel;
import java.awt.Scrollbar;
import java.awt.TextField;
import java.awt.event.WindowAdapter;
import java.awt.event.WindowEvent;
import java.util.Locale;

/**
 * The seed brush's control panel: a small window that stays open beside the image (it never blocks
 * ImageJ). Top: what a stroke paints (foreground, background, a further class 3..{@value
 * PaintClasses#MAX} by number and palette colour, or the eraser; a line says what Alt does) and the
 * brush width; middle: the cut's settings, the boundary penalty as a slider on a log scale from
 * {@value #LAMBDA_MIN} to {@value #LAMBDA_MAX} with its number (the contour follows while the
 * slider moves); bottom: actions and a status line with the flow value (= cut value) and the solve
 * time. Esc pressed on the panel stops a running cut; Ctrl+Z (Cmd+Z) is Undo. Event-thread only.
 */
final class BrushPanel extends Frame {
  private static final long serialVersionUID = 1L;
  static final double LAMBDA_MIN = 0.01;
  static final double LAMBDA_MAX = 100;
  static final int SLIDER_STEPS = 400;

  private final transient BrushSession session;
  private final transient BrushActions actions;
  private final Label status =
      new Label(
          "paint a foreground and a background stroke (further classes: 3 and up)", Label.LEFT);
  private final Scrollbar lambdaSlider =
      new Scrollbar(Scrollbar.HORIZONTAL, 0, 1, 0, SLIDER_STEPS + 1);
  private final TextField lambdaField = new TextField(6);
  private final TextField widthField;
  private final TextField contrastField = new TextField("auto", 6);
  private final Choice neighborhood = new Choice();
  private final Choice likelihood = new Choice();
  private final Checkbox volume = new Checkbox("Cut the stack as one volume (3D)");
  private final Choice paint = new Choice();

  /** The paint choice's last item. */
  static final String ERASER = "Eraser";

  /** What Alt does, shown under the paint choice. */
  static final String ALT_HELP =
      "Alt held: foreground ↔ background; on classes 3 to " + PaintClasses.MAX + ": background";

  BrushPanel(BrushSession session) {
    super("Cleave seed brush: " + session.imp.getTitle());
    this.session = session;
    this.actions = new BrushActions(session, this::showStatus);
    this.widthField = new TextField(SettingsFields.number(session.settings().width()), 4);
    setLayout(new GridBagLayout());
    GridBagConstraints g = new GridBagConstraints();
    g.anchor = GridBagConstraints.WEST;
    g.fill = GridBagConstraints.HORIZONTAL;
    g.gridy = 0;

    for (int c = 1; c <= PaintClasses.MAX; c++) {
      paint.add(PaintClasses.label(c));
    }
    paint.add(ERASER);
    paint.addItemListener(e -> session.setSettings(session.settings().withPaint(paintOf()), false));
    row(g, "Paint", paint);
    row(g, "", new Label(ALT_HELP));
    widthField.addTextListener(
        e -> {
          float w = number(widthField.getText(), -1);
          if (w >= 1 && w <= 500) {
            session.setSettings(session.settings().withWidth(w), false);
          }
        });
    row(g, "Brush width (pixels)", widthField);

    Panel lambda = new Panel(new java.awt.BorderLayout());
    lambda.add(lambdaSlider, java.awt.BorderLayout.CENTER);
    lambda.add(lambdaField, java.awt.BorderLayout.EAST);
    lambdaSlider.setBlockIncrement(SLIDER_STEPS / 10);
    setLambda(session.settings().boundaryPenalty());
    lambdaSlider.addAdjustmentListener(
        e -> {
          double l = lambdaOf(lambdaSlider.getValue());
          lambdaField.setText(format(l));
          session.setSettings(session.settings().withBoundaryPenalty(l), true);
        });
    lambdaField.addActionListener(
        e -> {
          double l = number(lambdaField.getText(), -1);
          if (l >= 0) {
            lambdaSlider.setValue(sliderOf(l));
            session.setSettings(session.settings().withBoundaryPenalty(l), true);
          } else {
            showStatus("boundary penalty: give a number of 0 or more");
          }
        });
    row(g, "Boundary penalty (smoother →)", lambda);
    contrastField.addActionListener(e -> cutSettingsChanged());
    row(g, "Contrast scale (auto or value)", contrastField);
    for (String s : new String[] {"auto", "4", "8", "16", "6", "18", "26"}) {
      neighborhood.add(s);
    }
    neighborhood.addItemListener(e -> cutSettingsChanged());
    row(g, "Neighborhood", neighborhood);
    for (String s : new String[] {"auto", "histogram", "mixture"}) {
      likelihood.add(s);
    }
    likelihood.addItemListener(e -> cutSettingsChanged());
    row(g, "Likelihood", likelihood);
    volume.setEnabled(session.time.depth() > 1);
    volume.addItemListener(e -> cutSettingsChanged());
    row(g, "Stacks", volume);

    Panel buttons = new Panel(new GridLayout(0, 3, 4, 4));
    button(buttons, "Undo", session::undo);
    button(buttons, "Clear", this::clear);
    button(buttons, "Help", HelpCommand::show);
    button(buttons, "Create mask", () -> actions.present(BrushActions.Output.MASK));
    button(buttons, "Create label image", () -> actions.present(BrushActions.Output.LABELS));
    button(buttons, "ROIs to ROI Manager", () -> actions.present(BrushActions.Output.ROIS));
    button(buttons, "Measure", () -> actions.present(BrushActions.Output.MEASURE));
    button(buttons, "Save seeds (ROI zip)", actions::saveRoiZip);
    button(buttons, "Save seed image", actions::saveSeedImage);
    button(buttons, "Load seeds", actions::load);
    button(buttons, "Save model (JSON)", actions::saveModel);
    button(buttons, "Close", this::dispose);
    g.gridx = 0;
    g.gridwidth = 2;
    add(buttons, g);
    g.gridy++;
    add(status, g);
    addWindowListener(
        new WindowAdapter() {
          @Override
          public void windowClosing(WindowEvent e) {
            dispose();
          }
        });
    session.stop.listenTo(this); // Esc stops a running cut, Ctrl+Z undoes
    pack();
  }

  @Override
  public void dispose() {
    SeedBrushTool.get().detach(session);
    session.close();
    super.dispose();
  }

  /** Shows a line in the status line (any thread). */
  void showStatus(String line) {
    EventQueue.invokeLater(() -> status.setText(line));
    IJ.showStatus("Cleave: " + line);
  }

  /** The paint choice's value: a class 1..{@value PaintClasses#MAX}, or the eraser (0). */
  private int paintOf() {
    int i = paint.getSelectedIndex();
    return i < PaintClasses.MAX ? i + 1 : BrushSettings.ERASER;
  }

  /** Chooses what strokes paint, as a user would (a class, or {@link BrushSettings#ERASER}). */
  void choosePaint(int c) {
    paint.select(c == BrushSettings.ERASER ? PaintClasses.MAX : c - 1);
    session.setSettings(session.settings().withPaint(paintOf()), false);
  }

  String statusText() {
    return status.getText();
  }

  /** Moves the boundary penalty slider, as a user would (for tests and macros). */
  void slideTo(double lambda) {
    setLambda(lambda);
    session.setSettings(session.settings().withBoundaryPenalty(lambdaOf(sliderOf(lambda))), true);
  }

  private void setLambda(double l) {
    lambdaSlider.setValue(sliderOf(l));
    lambdaField.setText(format(l));
  }

  private void clear() {
    session.strokes.clear();
    session.strokesChanged();
  }

  private void cutSettingsChanged() {
    String c = contrastField.getText().trim();
    double sigma = c.equalsIgnoreCase("auto") || c.isEmpty() ? Double.NaN : number(c, -1);
    if (!Double.isNaN(sigma) && !(sigma > 0)) {
      showStatus("contrast scale: give a positive number or auto");
      return;
    }
    String nb = neighborhood.getSelectedItem();
    ModelKind kind = SettingsFields.likelihood(likelihood.getSelectedItem());
    session.setSettings(
        session
            .settings()
            .withCut(sigma, nb.equals("auto") ? 0 : Integer.parseInt(nb), kind, volume.getState()),
        true);
  }

  /** λ for a slider position: log scale from LAMBDA_MIN to LAMBDA_MAX. */
  static double lambdaOf(int position) {
    double t = position / (double) SLIDER_STEPS;
    return LAMBDA_MIN * Math.pow(LAMBDA_MAX / LAMBDA_MIN, t);
  }

  /** The slider position nearest to λ (clamped to the slider's range). */
  static int sliderOf(double lambda) {
    if (!(lambda > LAMBDA_MIN)) {
      return 0;
    }
    double t = Math.log(lambda / LAMBDA_MIN) / Math.log(LAMBDA_MAX / LAMBDA_MIN);
    return (int) Math.max(0, Math.min(SLIDER_STEPS, Math.round(t * SLIDER_STEPS)));
  }

  static String format(double l) {
    return String.format(Locale.ROOT, l < 1 ? "%.3f" : l < 10 ? "%.2f" : "%.1f", l);
  }

  private static float number(String s, float fallback) {
    try {
      return Float.parseFloat(s.trim());
    } catch (NumberFormatException e) {
      return fallback;
    }
  }

  private void row(GridBagConstraints g, String label, java.awt.Component c) {
    g.gridx = 0;
    g.gridwidth = 1;
    g.weightx = 0;
    add(new Label(label), g);
    g.gridx = 1;
    g.weightx = 1;
    add(c, g);
    g.gridy++;
  }

  private static void button(Panel p, String text, Runnable action) {
    Button b = new Button(text);
    b.addActionListener(e -> action.run());
    p.add(b);
  }
}
