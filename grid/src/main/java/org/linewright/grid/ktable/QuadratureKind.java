package org.linewright.grid.ktable;

import java.util.Locale;
import org.linewright.ingest.InputException;

/** The g quadratures on [0, 1] a k-table can use (metadata {@code g_quadrature_kind}). */
public enum QuadratureKind {
    /** Gauss–Legendre with N points mapped onto [0, 1] (Gauss 1814; nodes and weights as in Abramowitz & Stegun 1964, table 25.4). */
    GAUSS_LEGENDRE("gauss_legendre",
            "Gauss-Legendre on [0, 1] (nodes and weights: Abramowitz & Stegun 1964, Handbook of Mathematical "
                    + "Functions, table 25.4, mapped from [-1, 1])"),
    /**
     * Gauss–Legendre with N/2 points on [0, 0.95] and N/2 on [0.95, 1], which resolves the steep strong-line end of
     * k(g). The split at g = 0.95 follows, from memory, the practice in correlated-k work since Goody, West, Chen &
     * Crisp (1989, JQSRT 42, 539) and its use in exoplanet opacities (e.g. Amundsen et al. 2014, A&A 564, A59);
     * not checked against the papers.
     */
    SPLIT_GAUSS_LEGENDRE("split_gauss_legendre",
            "Gauss-Legendre with N/2 points on [0, 0.95] and N/2 on [0.95, 1]; split at g = 0.95 as in correlated-k "
                    + "practice since Goody et al. 1989 (JQSRT 42, 539), e.g. Amundsen et al. 2014 (A&A 564, A59); "
                    + "recalled from memory");

    private final String id;
    private final String source;

    QuadratureKind(String id, String source) {
        this.id = id;
        this.source = source;
    }

    /** The name in metadata and on the command line ({@code gauss_legendre}, {@code split_gauss_legendre}). */
    public String id() {
        return id;
    }

    /** The published source of the choice (metadata {@code g_quadrature_source}). */
    public String source() {
        return source;
    }

    /**
     * The kind named {@code text} (its id, case-insensitive, '-' and '_' alike).
     *
     * @throws InputException for anything else
     */
    public static QuadratureKind parse(String text) {
        String s = text.strip().toLowerCase(Locale.ROOT).replace('-', '_');
        for (QuadratureKind k : values()) {
            if (k.id.equals(s)) {
                return k;
            }
        }
        throw new InputException("g quadrature " + org.linewright.ingest.text.OffendingText.quote(text)
                + " (expected gauss_legendre or split_gauss_legendre)");
    }
}
