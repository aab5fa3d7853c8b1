package org.linewright.cli.plot;

/**
 * Title and pixel size of a PNG plot.
 *
 * @param title    the title drawn above the plot (may be empty)
 * @param widthPx  image width in pixels, at least {@value #MIN_SIZE_PX}
 * @param heightPx image height in pixels, at least {@value #MIN_SIZE_PX}
 */
public record PlotStyle(String title, int widthPx, int heightPx) {
    /** Smallest accepted width or height, in pixels. */
    public static final int MIN_SIZE_PX = 100;
    /** Largest accepted width or height, in pixels. */
    public static final int MAX_SIZE_PX = 10_000;

    public PlotStyle {
        if (title == null) {
            title = "";
        }
        if (widthPx < MIN_SIZE_PX || heightPx < MIN_SIZE_PX || widthPx > MAX_SIZE_PX || heightPx > MAX_SIZE_PX) {
            throw new IllegalArgumentException("plot size " + widthPx + "x" + heightPx + " px is outside "
                    + MIN_SIZE_PX + "–" + MAX_SIZE_PX + " px");
        }
    }

    /** A 1000 × 600 px plot with the given title. */
    public static PlotStyle of(String title) {
        return new PlotStyle(title, 1000, 600);
    }
}
