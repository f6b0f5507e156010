namespace Lumen.Blackbody;

/// <summary>A point of the Planckian locus in the CIE 1960 UCS with its derivatives with respect to mired.</summary>
/// <param name="U">u of the Planckian radiator.</param>
/// <param name="V">v of the Planckian radiator.</param>
/// <param name="DuDm">du/dm, per mired (m = 10⁶/T).</param>
/// <param name="DvDm">dv/dm, per mired.</param>
/// <param name="D2uDm2">d²u/dm², per mired².</param>
/// <param name="D2vDm2">d²v/dm², per mired².</param>
internal readonly record struct LocusPoint(double U, double V, double DuDm, double DvDm, double D2uDm2, double D2vDm2);
