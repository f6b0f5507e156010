using Lumen.Analysis;
using Lumen.Spectra;

namespace Lumen.Core.Tests;

/// <summary>
/// What an assessment says about its own methods. Issue 16 shares one read-only set of method texts between consecutive
/// assessments instead of building it for each: every assessment must still name the sampling and band it used, whatever
/// was assessed before it, and nobody may change the shared texts. The sampling rule itself (own step on the CIE 1 and
/// 5 nm grids, else Sprague to 1 nm) is CIE 15 and CIE 167 (docs/methods/colorimetry.md §1.4).
/// </summary>
public class ProvenanceTests
{
    private static Spectrum Smooth(double first, double last, double step, double peak)
    {
        int n = (int)Math.Round((last - first) / step) + 1;
        var w = Enumerable.Range(0, n).Select(i => first + step * i).ToArray();
        var v = w.Select(x => 0.1 + Math.Exp(-Math.Pow((x - peak) / 80, 2))).ToArray();
        return new Spectrum(w, v, SpectralUnit.Relative, $"smooth-{step}", new SpectrumOrigin("made-up.csv", 2));
    }

    [Fact]
    public void Each_assessment_names_its_own_sampling_and_band_when_the_texts_are_shared()
    {
        var oneNm = Assessor.Assess(Smooth(380, 780, 1, 560));
        var fiveNm = Assessor.Assess(Smooth(380, 780, 5, 560));
        var twoNm = Assessor.Assess(Smooth(400, 700, 2, 560));
        var oneNmAgain = Assessor.Assess(Smooth(380, 780, 1, 600));

        Assert.Equal("summed at the spectrum's own 1 nm step (CIE 15)", oneNm.Provenance.Methods["sampling"]);
        Assert.Equal("summed at the spectrum's own 5 nm step (CIE 15)", fiveNm.Provenance.Methods["sampling"]);
        Assert.Equal("Sprague interpolation (CIE 167) from 2 nm to 1 nm", twoNm.Provenance.Methods["sampling"]);
        foreach (var a in new[] { oneNm, fiveNm, twoNm, oneNmAgain })
        {
            Assert.Equal(a.Provenance.Sampling, a.Provenance.Methods["sampling"]);
            Assert.EndsWith($"LER over the measured band {a.Provenance.IntegrationStartNm}–{a.Provenance.IntegrationEndNm} nm", a.Provenance.Methods["photometry"], StringComparison.Ordinal);
        }
        Assert.EndsWith("400–700 nm", twoNm.Provenance.Methods["photometry"], StringComparison.Ordinal);
        Assert.Equal(oneNm.Provenance.Methods, oneNmAgain.Provenance.Methods);
        Assert.Equal(oneNm.Provenance.Methods, fiveNm.Provenance.Methods.Select(kv => kv.Key == "sampling" ? new KeyValuePair<string, string>(kv.Key, oneNm.Provenance.Sampling) : kv));
        Assert.Throws<NotSupportedException>(() => ((IDictionary<string, string>)oneNm.Provenance.Methods)["cct"] = "changed");
        Assert.Throws<NotSupportedException>(() => ((IList<string>)oneNm.Provenance.Standards)[0] = "changed");
    }

    [Fact]
    public void Samples_on_the_cie_grid_are_the_spectrums_own_values()
    {
        var s = Smooth(380, 780, 1, 560);
        var samples = Resampler.ForCieSums(s);
        Assert.Equal(380, samples.StartNm);
        Assert.Equal(1, samples.StepNm);
        Assert.Equal(s.Values.ToArray(), samples.Values);
    }
}
