using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Mixing;
using Lumen.Spectra;
using Lumen.Temperature;

namespace Lumen.Core.Tests;

/// <summary>Channel mixing: exact three-channel solutions, optimisation against brute force, out-of-gamut targets.</summary>
public class MixingTests
{
    private static readonly double[] Grid = WavelengthGrid.Regular(380, 780, 1);

    // Invented LED-like channels (Gaussian emitters; a broad "lime" phosphor) — demo shapes, not real products.
    private static Spectrum Led(string name, double peak, double width, double height = 1) =>
        new(Grid, Grid.Select(w => height * Math.Exp(-Math.Pow((w - peak) / width, 2) / 2)).ToArray(), SpectralUnit.Relative, name, SpectrumOrigin.Generated("test"));

    private static readonly Spectrum Red = Led("red", 630, 9), Green = Led("green", 525, 14), Blue = Led("blue", 455, 9), Amber = Led("amber", 592, 7), Lime = Led("lime", 555, 45, 0.8);

    private static Tristimulus Xyz(Spectrum s) => Colorimeter.RawSums(Resampler.ForCieSums(s), Observer.Cie1931TwoDegree);

    private static Spectrum Mix(IReadOnlyList<Spectrum> ch, IReadOnlyList<double> levels) =>
        new(Grid, Grid.Select((w, i) => ch.Select((c, k) => levels[k] * c.Values[i]).Sum()).ToArray(), SpectralUnit.Relative, "mix", SpectrumOrigin.Generated("t"));

    [Fact]
    public void Three_channels_hit_the_target_exactly()
    {
        var target = CctSolver.ToChromaticity(4000, 0.002);
        var r = ChannelMixer.Solve([Red, Green, Blue], target);
        Assert.True(r.Reachable);
        var c = Chromaticity.FromXyz(Xyz(Mix([Red, Green, Blue], r.Levels)));
        Assert.True(c.DeltaUPrimeVPrime(target) < 1e-9, c.DeltaUPrimeVPrime(target).ToString(System.Globalization.CultureInfo.InvariantCulture));
        Assert.Equal(1, r.Levels.Max(), 12);
        Assert.All(r.Levels, l => Assert.InRange(l, 0, 1));
        Assert.Equal(0, r.Iterations);
    }

    [Fact]
    public void A_target_at_one_channel_gives_that_channel_alone()
    {
        var target = Chromaticity.FromXyz(Xyz(Amber));
        var r = ChannelMixer.Solve([Red, Green, Blue, Amber], target);
        Assert.Equal([0.0, 0.0, 0.0, 1.0], r.Levels.Select(l => Math.Round(l, 9)).ToArray());
    }

    [Fact]
    public void Random_reachable_targets_are_hit_within_tolerance_with_levels_in_range()
    {
        var ch = new[] { Red, Green, Blue, Amber, Lime };
        var rng = new Random(12);
        for (int trial = 0; trial < 12; trial++)
        {
            var w = ch.Select(_ => rng.NextDouble()).ToArray();
            var target = Chromaticity.FromXyz(Xyz(Mix(ch, w)));
            var r = ChannelMixer.Solve(ch, target, MixObjective.MaximizeOutput);
            Assert.True(r.Reachable);
            Assert.True(r.DeltaUPrimeVPrime <= ChannelMixer.DefaultTolerance, $"trial {trial}: {r.DeltaUPrimeVPrime}");
            Assert.All(r.Levels, l => Assert.InRange(l, 0, 1 + 1e-12));
        }
    }

    [Fact]
    public void Four_channels_the_optimiser_is_within_half_a_point_of_brute_force_Rf()
    {
        var ch = new[] { Red, Green, Blue, Lime };
        var target = CctSolver.ToChromaticity(3500, 0);
        var r = ChannelMixer.Solve(ch, target, MixObjective.MaximizeRf);
        // Brute force: every mix on a 0.01 grid of the simplex (Rf does not depend on scale), kept when within the tolerance.
        var xyz = ch.Select(Xyz).ToArray();
        double best = double.NegativeInfinity;
        for (int a = 0; a <= 100; a++)
            for (int b = 0; a + b <= 100; b++)
                for (int c = 0; a + b + c <= 100; c++)
                {
                    double[] l = [a / 100.0, b / 100.0, c / 100.0, (100 - a - b - c) / 100.0];
                    var t = new Tristimulus(l.Select((x, i) => x * xyz[i].X).Sum(), l.Select((x, i) => x * xyz[i].Y).Sum(), l.Select((x, i) => x * xyz[i].Z).Sum());
                    if (Chromaticity.FromXyz(t).DeltaUPrimeVPrime(target) > ChannelMixer.DefaultTolerance) continue;
                    var samples = Resampler.ForCieSums(Mix(ch, l));
                    double cct = CctSolver.Solve(Chromaticity.FromXyz(t)).CctKelvin;
                    best = Math.Max(best, Lumen.Rendition.FidelityIndex.Compute(samples, cct).Rf);
                }
        Assert.True(double.IsFinite(best));
        Assert.True(r.Metrics.Rf >= best - 0.5, $"optimiser {r.Metrics.Rf:0.00}, brute force {best:0.00}");
    }

    [Fact]
    public void An_unreachable_target_is_reported_with_the_brute_force_distance_to_the_gamut()
    {
        var ch = new[] { Red, Amber, Lime };
        var target = CctSolver.ToChromaticity(6500, 0); // bluish white: no blue channel
        var r = ChannelMixer.Solve(ch, target);
        Assert.False(r.Reachable);
        Assert.Contains(r.Warnings, w => w.Contains("outside the channels' gamut", StringComparison.Ordinal));
        var xyz = ch.Select(Xyz).ToArray();
        double best = double.PositiveInfinity;
        for (int a = 0; a <= 1000; a++)
            for (int b = 0; a + b <= 1000; b++)
            {
                double[] l = [a / 1000.0, b / 1000.0, (1000 - a - b) / 1000.0];
                var t = new Tristimulus(l.Select((x, i) => x * xyz[i].X).Sum(), l.Select((x, i) => x * xyz[i].Y).Sum(), l.Select((x, i) => x * xyz[i].Z).Sum());
                best = Math.Min(best, Chromaticity.FromXyz(t).DeltaUPrimeVPrime(target));
            }
        Assert.Equal(best, r.DeltaUPrimeVPrime, 4);
    }

    [Fact]
    public void The_same_inputs_give_the_same_levels_bit_for_bit()
    {
        var ch = new[] { Red, Green, Blue, Amber, Lime };
        var target = CctSolver.ToChromaticity(3000, 0.001);
        var a = ChannelMixer.Solve(ch, target);
        var b = ChannelMixer.Solve(ch, target);
        Assert.Equal(a.Levels.Select(BitConverter.DoubleToInt64Bits), b.Levels.Select(BitConverter.DoubleToInt64Bits));
    }

    [Fact]
    public void Five_channels_beat_the_best_three_channel_subset_on_Rf()
    {
        var ch = new[] { Red, Green, Blue, Amber, Lime };
        var target = CctSolver.ToChromaticity(3000, 0);
        var five = ChannelMixer.Solve(ch, target);
        var three = ChannelMixer.Solve([Red, Green, Blue], target);
        Assert.True(five.Metrics.Rf >= three.Metrics.Rf, $"{five.Metrics.Rf} vs {three.Metrics.Rf}");
        Assert.True(five.DeltaUPrimeVPrime < 1e-6);
    }
}
