package org.linewright.grid.engine.fast;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * Four-point Lagrange weights reproduce the moments of order 0 … 3 and not 4 (interpolation of polynomials up to
 * degree 3 is exact; the degree-4 remainder is ω(u) = Π(u − uⱼ), Abramowitz &amp; Stegun 25.2.3).
 */
class LagrangeWeightsTest {

    @Test
    void uniformWeightsReproduceMomentsUpToThree() {
        double[] w = new double[4];
        double[] nodes = {-1, 0, 1, 2};
        for (double tau = 0; tau < 1; tau += 0.0625) {
            LagrangeWeights.uniform(tau, w, 0);
            for (int order = 0; order <= 3; order++) {
                double moment = 0;
                for (int j = 0; j < 4; j++) {
                    moment += w[j] * Math.pow(nodes[j], order);
                }
                assertEquals(Math.pow(tau, order), moment, 1e-14, "order " + order + " at " + tau);
            }
            // fourth moment: off by exactly −ω(τ) = −(τ+1)τ(τ−1)(τ−2)
            double fourth = 0;
            for (int j = 0; j < 4; j++) {
                fourth += w[j] * Math.pow(nodes[j], 4);
            }
            double omega = (tau + 1) * tau * (tau - 1) * (tau - 2);
            assertEquals(Math.pow(tau, 4) - omega, fourth, 1e-13);
        }
    }

    @Test
    void sixPointWeightsReproduceMomentsUpToFive() {
        double[] w = new double[6];
        for (double tau = 0; tau < 1; tau += 0.0625) {
            LagrangeWeights.centred(6, tau, w, 0);
            for (int order = 0; order <= 6; order++) {
                double moment = 0;
                for (int j = 0; j < 6; j++) {
                    moment += w[j] * Math.pow(j - 2, order);
                }
                // order 6 is off by −ω(τ) = −Π(τ − xⱼ) over the nodes −2 … 3
                double omega = order < 6 ? 0 : (tau + 2) * (tau + 1) * tau * (tau - 1) * (tau - 2) * (tau - 3);
                assertEquals(Math.pow(tau, order) - omega, moment, 1e-12, "order " + order + " at " + tau);
            }
        }
        // four points through the general routine agree with the closed forms
        double[] four = new double[4];
        LagrangeWeights.centred(4, 0.3, four, 0);
        double[] closed = new double[4];
        LagrangeWeights.uniform(0.3, closed, 0);
        for (int j = 0; j < 4; j++) {
            assertEquals(closed[j], four[j], 1e-15);
        }
    }

    @Test
    void generalWeightsOnUnevenNodesReproduceCubics() {
        double[] nodes = {0.7, 1.0, 1.6, 2.9, 5.0};
        double[] w = new double[4];
        double u = 1.3;
        LagrangeWeights.general(u, nodes, 1, w, 0);
        double cubic = 0;
        for (int j = 0; j < 4; j++) {
            double x = nodes[1 + j];
            cubic += w[j] * (2 - 3 * x + 0.5 * x * x - 0.25 * x * x * x);
        }
        assertEquals(2 - 3 * u + 0.5 * u * u - 0.25 * u * u * u, cubic, 1e-13);
    }

    @Test
    void widthAxisBracketsAndWeighsEveryWidth() {
        WidthAxis axis = WidthAxis.geometric(0.01, 0.08, 0.3, 2);
        assertEquals(4, axis.stencilSize());
        assertTrue(axis.logStep() <= 0.3);
        double[] w = new double[4];
        for (double width = 0.01; width <= 0.08; width *= 1.07) {
            int first = axis.stencil(width, w, 0);
            assertTrue(axis.widthCm1(first + 1) <= width * (1 + 1e-12) && width <= axis.widthCm1(first + 2) * (1 + 1e-12),
                    "stencil brackets " + width);
            double sum = 0;
            double variance = 0;
            for (int j = 0; j < 4; j++) {
                sum += w[j];
                variance += w[j] * axis.widthCm1(first + j) * axis.widthCm1(first + j);
            }
            assertEquals(1.0, sum, 1e-12);
            // the Doppler axis interpolates in αD²: Gaussians convolve by adding variances (common practice)
            assertEquals(width * width, variance, 1e-12 * width * width);
        }
        WidthAxis single = WidthAxis.geometric(0.05, 0.05, 0.3, 1);
        assertEquals(1, single.size());
        assertEquals(1, single.stencilSize());
    }
}
