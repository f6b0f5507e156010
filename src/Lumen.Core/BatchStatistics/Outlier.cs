namespace Lumen.BatchStatistics;

/// <summary>A unit flagged as a chromaticity outlier.</summary>
/// <param name="Id">Record ID (name).</param>
/// <param name="DeltaUPrimeVPrime">Δu′v′ from the batch median chromaticity.</param>
/// <param name="RobustZ">(d − median d) / (1.4826·MAD).</param>
public sealed record Outlier(string Id, double DeltaUPrimeVPrime, double RobustZ);
