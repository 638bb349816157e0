namespace Thermostrat.Model.Orbital;

/// <summary>Angle conversions and normalization shared by the orbital code.</summary>
internal static class Angles
{
    public const double DegToRad = Math.PI / 180.0;
    public const double RadToDeg = 180.0 / Math.PI;
    public const double ArcsecToRad = Math.PI / (180.0 * 3600.0);
    public const double TwoPi = 2.0 * Math.PI;

    /// <summary>An angle in degrees reduced to [0, 360).</summary>
    public static double Normalize360(double deg)
    {
        // Fast paths for the common cases (one turn either side); the remainder operator is slow.
        if (deg >= 0.0 && deg < 360.0) return deg;
        if (deg < 0.0 && deg >= -360.0)
        {
            double shifted = deg + 360.0;
            return shifted >= 360.0 ? 0.0 : shifted;
        }
        double r = deg % 360.0;
        if (r < 0) r += 360.0;
        return r >= 360.0 ? 0.0 : r;
    }

    /// <summary>An angle in radians reduced to [0, 2π).</summary>
    public static double NormalizeTwoPi(double rad)
    {
        if (rad >= 0.0 && rad < TwoPi) return rad;
        if (rad < 0.0 && rad >= -TwoPi)
        {
            double shifted = rad + TwoPi;
            return shifted >= TwoPi ? 0.0 : shifted;
        }
        if (rad >= TwoPi && rad < 2.0 * TwoPi)
        {
            double shifted = rad - TwoPi;
            return shifted < 0.0 ? 0.0 : shifted;
        }
        double r = rad % TwoPi;
        if (r < 0) r += TwoPi;
        return r >= TwoPi ? 0.0 : r;
    }
}
