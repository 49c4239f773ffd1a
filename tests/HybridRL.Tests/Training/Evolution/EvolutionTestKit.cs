using HybridRL.Training.Evolution;

namespace HybridRL.Tests.Training.Evolution;

/// <summary>A function to be minimised.</summary>
internal delegate double Objective(ReadOnlySpan<double> x);

/// <summary>Test functions with known minima and a loop that minimises them with an ask/tell optimiser.</summary>
internal static class EvolutionTestKit
{
    /// <summary>Sphere Σ xᵢ²: minimum 0 at the origin.</summary>
    public static double Sphere(ReadOnlySpan<double> x)
    {
        double s = 0;
        foreach (double v in x) s += v * v;
        return s;
    }

    /// <summary>Rosenbrock Σ 100 (xᵢ₊₁ − xᵢ²)² + (1 − xᵢ)²: minimum 0 at (1, …, 1).</summary>
    public static double Rosenbrock(ReadOnlySpan<double> x)
    {
        double s = 0;
        for (int i = 0; i + 1 < x.Length; i++)
        {
            double a = x[i + 1] - x[i] * x[i], b = 1 - x[i];
            s += 100 * a * a + b * b;
        }
        return s;
    }

    /// <summary>Axis-parallel ellipsoid Σ 10^(6 i/(n−1)) xᵢ² (condition number 10⁶): minimum 0 at the origin.</summary>
    public static double Ellipsoid(ReadOnlySpan<double> x)
    {
        int n = x.Length;
        double s = 0;
        for (int i = 0; i < n; i++) s += Math.Pow(10, 6.0 * i / Math.Max(1, n - 1)) * x[i] * x[i];
        return s;
    }

    /// <summary>
    /// Minimises <paramref name="f"/> by maximising −f until the best value is below <paramref name="target"/>
    /// or <paramref name="maxGenerations"/> generations have run. Returns the generations used.
    /// </summary>
    public static int Minimise(IEvolutionStrategy es, Objective f, int maxGenerations, double target = 0)
    {
        int n = es.Dimension;
        var population = new double[es.PopulationSize * n];
        var fitness = new double[es.PopulationSize];
        for (int g = 0; g < maxGenerations; g++)
        {
            es.Ask(population);
            for (int k = 0; k < es.PopulationSize; k++) fitness[k] = -f(population.AsSpan(k * n, n));
            es.Tell(fitness);
            if (-es.BestFitness < target) return g + 1;
        }
        return maxGenerations;
    }

    public static double[] Filled(int n, double value)
    {
        var x = new double[n];
        Array.Fill(x, value);
        return x;
    }
}
