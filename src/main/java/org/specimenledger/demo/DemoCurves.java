package org.specimenledger.demo;

import java.nio.charset.StandardCharsets;
import java.util.Locale;
import java.util.Random;
import java.util.function.DoubleUnaryOperator;

/**
 * Invented raw curve files for the demo laboratory, in the service's input format, as a testing machine
 * would write them: sampled at a fixed rate, a time channel, force in kN (N for the elastomer), extension in
 * mm, small measurement noise from a fixed seed. Each curve comes from a simple engineering stress–strain
 * model of its own; the numbers are invented and only meant to be physically plausible, not to describe any
 * real material or product.
 *
 * <p>The metal curves run at the ISO 6892-1 method A rates the demo runs declare: 0.00025 s⁻¹ up to the end
 * of yielding, then 0.0067 s⁻¹ to fracture (ranges 2 and 4 [M]).
 */
final class DemoCurves {

    private static final double ELASTIC_RATE = 0.00025;
    private static final double HARDENING_RATE = 0.0067;

    private DemoCurves() {
    }

    /**
     * Structural steel with discontinuous yielding: elastic to ReH 398 MPa, a drop and a Lüders plateau near
     * 372 MPa to 1.8 % strain, work hardening to a maximum of 528 MPa at 16 %, necking, fracture at 25 %.
     */
    static byte[] structuralSteel(double s0Mm2, double leMm, String label) {
        double e = 205_000;
        double reh = 398;
        double rel = 372;
        double lueders = 0.018;
        double eu = 0.16;
        double rm = 528;
        double ef = 0.25;
        DoubleUnaryOperator stress = strain -> {
            if (strain <= reh / e) {
                return e * strain;
            }
            double drop = reh / e + 0.0002;
            if (strain < drop) {
                return reh - (reh - rel) * (strain - reh / e) / 0.0002;
            }
            if (strain < lueders) {
                // the Lüders band runs along the piece: small oscillations about the lower yield level
                return rel + 2.5 * Math.sin((strain - drop) / 0.0011 * Math.PI);
            }
            if (strain <= eu) {
                double u = (eu - strain) / (eu - lueders);
                return rm - (rm - rel) * u * u;
            }
            double v = (strain - eu) / (ef - eu);
            return rm * (1 - 0.18 * v * v);
        };
        return curve(label, "kN", s0Mm2, leMm, ef, lueders, stress, 4.0, 11);
    }

    /**
     * A quenched and tempered alloy steel yielding continuously: Ramberg–Osgood with E 208 GPa, σ0.2 820 MPa,
     * n 14, a maximum near 6 % strain, then necking to fracture at 12 %.
     */
    static byte[] alloySteel(double s0Mm2, double leMm, String label) {
        return necking(label, s0Mm2, leMm, 208_000, 820, 14, 0.06, 0.12, 0.10, 12);
    }

    /** An aluminium alloy in the T6 temper: E 70 GPa, σ0.2 292 MPa, n 22, maximum near 8 %, fracture at 11.5 %. */
    static byte[] aluminiumAlloy(double s0Mm2, double leMm, String label) {
        return necking(label, s0Mm2, leMm, 70_000, 292, 22, 0.08, 0.115, 0.08, 13);
    }

    /**
     * A brittle cast piece: non-linear from the start (Ramberg–Osgood E 110 GPa, σ0.2 230 MPa, n 6) and
     * fracturing at 195 MPa, before 0.2 % plastic extension is reached.
     */
    static byte[] brittleCast(double s0Mm2, double leMm, String label) {
        double e = 110_000;
        double fracture = 195;
        double ef = fracture / e + 0.002 * Math.pow(fracture / 230, 6);
        return curve(label, "kN", s0Mm2, leMm, ef, ef, strain -> rambergOsgoodStress(strain, e, 230, 6), 0.5, 14);
    }

    /**
     * An elastomer strip pulled in three loading–unloading cycles to 100 % strain at 500 mm/min: loading on a
     * neo-Hookean curve σ = G(λ − 1/λ²) with G = 1.5 MPa, unloading below it (hysteresis), each cycle
     * returning to a small residual extension. Force in N.
     */
    static byte[] elastomerCycles(double s0Mm2, double leMm, String label) {
        Random noise = new Random(15);
        StringBuilder csv = header(label, "N");
        double g = 1.5;
        double peak = leMm;
        double speed = 500.0 / 60; // mm/s
        double t = 0;
        int perBranch = 400;
        double residual = 0;
        for (int cycle = 0; cycle < 3; cycle++) {
            for (int i = 0; i <= perBranch; i++) {
                double x = residual + (peak - residual) * i / perBranch;
                double lambda = 1 + x / leMm;
                double f = g * (lambda - 1 / (lambda * lambda)) * s0Mm2;
                row(csv, t, f + noise.nextGaussian() * 0.02, x);
                t += (peak - residual) / perBranch / speed;
            }
            double nextResidual = 0.6 * (cycle + 1);
            for (int i = 1; i <= perBranch; i++) {
                double x = peak - (peak - nextResidual) * i / perBranch;
                double lambda = 1 + x / leMm;
                double shape = (x - nextResidual) / (peak - nextResidual);
                double f = g * (lambda - 1 / (lambda * lambda)) * s0Mm2 * shape * shape;
                row(csv, t, Math.max(0, f + noise.nextGaussian() * 0.02), x);
                t += (peak - nextResidual) / perBranch / speed;
            }
            residual = nextResidual;
        }
        return csv.toString().getBytes(StandardCharsets.UTF_8);
    }

    private static byte[] necking(String label, double s0Mm2, double leMm, double e, double sigma02, double n,
            double eu, double ef, double neckDrop, long seed) {
        double su = rambergOsgoodStress(eu, e, sigma02, n);
        DoubleUnaryOperator stress = strain -> {
            if (strain <= eu) {
                return rambergOsgoodStress(strain, e, sigma02, n);
            }
            double v = (strain - eu) / (ef - eu);
            return su * (1 - neckDrop * v * v);
        };
        return curve(label, "kN", s0Mm2, leMm, ef, sigma02 / e + 0.002, stress, 2.0, seed);
    }

    /**
     * Samples a model at 50 Hz: strain grows at the elastic rate up to {@code switchStrain}, then at the
     * hardening rate; after the last point the force falls away within two samples (fracture).
     */
    private static byte[] curve(String label, String forceUnit, double s0Mm2, double leMm, double fractureStrain,
            double switchStrain, DoubleUnaryOperator stressMPa, double forceNoiseN, long seed) {
        Random noise = new Random(seed);
        StringBuilder csv = header(label, forceUnit);
        double dt = 0.02;
        double t = 0;
        double strain = 0;
        double last = 0;
        while (strain <= fractureStrain) {
            double forceN = stressMPa.applyAsDouble(strain) * s0Mm2 + noise.nextGaussian() * forceNoiseN;
            double extension = strain * leMm + noise.nextGaussian() * 0.0001;
            row(csv, t, forceN / 1000, extension);
            last = extension;
            strain += (strain < switchStrain ? ELASTIC_RATE : HARDENING_RATE) * dt;
            t += dt;
        }
        row(csv, t, 0.015 * stressMPa.applyAsDouble(fractureStrain) * s0Mm2 / 1000, last + 0.004);
        row(csv, t + dt, 0.0, last + 0.008);
        return csv.toString().getBytes(StandardCharsets.UTF_8);
    }

    private static StringBuilder header(String label, String forceUnit) {
        StringBuilder csv = new StringBuilder();
        csv.append("# laboratory: demo laboratory (invented)\n");
        csv.append("# piece: ").append(label).append('\n');
        csv.append("# sampling: 50 Hz\n");
        csv.append("time [s],force [").append(forceUnit).append("],extension [mm]\n");
        return csv;
    }

    private static void row(StringBuilder csv, double t, double force, double extension) {
        csv.append(String.format(Locale.ROOT, "%.3f,%.5f,%.5f%n", t, force, extension));
    }

    /** The stress whose Ramberg–Osgood strain σ/E + 0.002 (σ/σ0.2)^n equals {@code strain}, by bisection. */
    static double rambergOsgoodStress(double strain, double e, double sigma02, double n) {
        double lo = 0;
        double hi = e * strain + 1;
        for (int k = 0; k < 100; k++) {
            double mid = (lo + hi) / 2;
            if (mid / e + 0.002 * Math.pow(mid / sigma02, n) < strain) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return (lo + hi) / 2;
    }
}
