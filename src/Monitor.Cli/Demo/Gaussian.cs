namespace Monitor.Cli.Demo;

/// <summary>Standard normal draws from a seeded <see cref="Random"/> (Box-Muller transform).</summary>
internal static class Gaussian
{
    public static double Next(Random random)
    {
        var u1 = 1.0 - random.NextDouble(); // in (0, 1]: log(0) is avoided
        var u2 = random.NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
    }
}
