namespace Lumen.Rendition;

/// <summary>IES TM-30 values of one of the 16 hue-angle bins.</summary>
/// <param name="Index">Bin number 1–16 (bin 1 = hue 0°–22.5°).</param>
/// <param name="SampleCount">Number of colour evaluation samples in the bin (by hue under the reference).</param>
/// <param name="Rf">Local fidelity Rf,hj.</param>
/// <param name="Rcs">Local chroma shift Rcs,hj as a fraction (×100 for %).</param>
/// <param name="Rhs">Local hue shift Rhs,hj (dimensionless).</param>
/// <param name="ReferenceA">Bin-average a′ under the reference.</param>
/// <param name="ReferenceB">Bin-average b′ under the reference.</param>
/// <param name="TestA">Bin-average a′ under the test source.</param>
/// <param name="TestB">Bin-average b′ under the test source.</param>
public readonly record struct HueBin(int Index, int SampleCount, double Rf, double Rcs, double Rhs,
    double ReferenceA, double ReferenceB, double TestA, double TestB);
