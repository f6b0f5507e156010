using System.Text.Json;
using Lumen.Uncertainty;

namespace Lumen.Formats;

/// <summary>The one JSON form of a result's measurement uncertainty, shared by analyze and batch rows.</summary>
internal static class JsonUncertainty
{
    /// <summary>Writes <c>uncertainty</c> {<c>model</c>, <c>draws</c>, <c>seed</c>, <c>adaptive</c>, <c>fields</c>
    /// {path: {<c>standard</c>, <c>low</c>, <c>high</c>, <c>coverage</c>, <c>mean</c>, <c>draws</c>, <c>linear</c>}},
    /// <c>uPrimeVPrimeCovariance</c>, <c>warnings</c>}.</summary>
    public static void Write(Utf8JsonWriter w, UncertaintyResult u)
    {
        w.WriteStartObject("uncertainty");
        WriteModel(w, u.Model);
        w.WriteNumber("draws", u.Draws);
        w.WriteNumber("seed", u.Seed);
        w.WriteBoolean("adaptive", u.Adaptive);
        w.WriteString("method", "Monte Carlo, JCGM 101:2008 (GUM Supplement 1); probabilistically symmetric 95 % intervals; linear: law of propagation, JCGM 100:2008");
        w.WriteStartObject("fields");
        foreach (var (path, f) in u.Fields)
        {
            w.WriteStartObject(path);
            w.NumberOrNull("standard", f.Standard);
            w.NumberOrNull("low", f.Low);
            w.NumberOrNull("high", f.High);
            w.WriteNumber("coverage", FieldUncertainty.Coverage);
            w.NumberOrNull("mean", f.Mean);
            w.WriteNumber("draws", f.Draws);
            if (f.Linear is { } lin) w.NumberOrNull("linear", lin);
            w.WriteEndObject();
        }
        w.WriteEndObject();
        var (uu, uv, vv) = u.UPrimeVPrimeCovariance;
        w.WriteStartObject("uPrimeVPrimeCovariance");
        w.NumberOrNull("uu", uu); w.NumberOrNull("uv", uv); w.NumberOrNull("vv", vv);
        w.WriteEndObject();
        w.StringArray("warnings", u.Warnings);
        w.WriteEndObject();
    }

    /// <summary>Writes <c>model</c> as the model file names its components.</summary>
    public static void WriteModel(Utf8JsonWriter w, UncertaintyModel m)
    {
        w.WriteStartObject("model");
        if (m.RelativeNoise > 0) w.WriteNumber("relativeNoise", m.RelativeNoise);
        if (m.AbsoluteNoise > 0) w.WriteNumber("absoluteNoise", m.AbsoluteNoise);
        if (m.RelativeScale > 0) w.WriteNumber("relativeScale", m.RelativeScale);
        if (m.SmoothRelative > 0)
        {
            w.WriteStartObject("smoothRelative");
            w.WriteNumber("sigma", m.SmoothRelative);
            w.WriteNumber("correlationLengthNm", m.CorrelationLengthNm);
            w.WriteEndObject();
        }
        if (m.WavelengthShiftNm > 0) w.WriteNumber("wavelengthShiftNm", m.WavelengthShiftNm);
        if (m.BandwidthNm is { } b) w.WriteNumber("bandwidthNm", b);
        w.WriteString("note", "standard uncertainties (k = 1); the bandwidth is recorded, no deconvolution is done");
        w.WriteEndObject();
    }
}
