using HybridRL.Training.Evolution;
using MathNet.Numerics.LinearAlgebra;
using static HybridRL.Tests.Training.Evolution.EvolutionTestKit;

namespace HybridRL.Tests.Training.Evolution;

public class CmaEvolutionStrategyTests
{
    [Fact]
    public void DefaultStrategyParametersForTenDimensionsMatchTable1ByHand()
    {
        var cma = new CmaEvolutionStrategy(new CmaEsSettings(), new double[10], seed: 1);

        // Hansen 2016, Table 1: λ = 4 + ⌊3 ln 10⌋ = 4 + ⌊6.9078⌋ = 10, μ = ⌊λ/2⌋ = 5.
        Assert.Equal(10, cma.PopulationSize);
        Assert.Equal(10, CmaEsSettings.DefaultPopulation(10));
        Assert.Equal(5, cma.Mu);
        Assert.False(cma.IsDiagonal);

        // Hand-worked: w'ᵢ = ln 5.5 − ln i = 1.70475, 1.01160, 0.60614, 0.31845, 0.09531; Σw' = 3.73625.
        double[] raw = [1.70475, 1.01160, 0.60614, 0.31845, 0.09531];
        double rawSum = 3.73625;
        double weightSum = 0;
        for (int i = 0; i < 5; i++)
        {
            Assert.Equal(raw[i] / rawSum, cma.Weights[i], 4); // hand-worked normalised weights
            weightSum += cma.Weights[i];
            if (i > 0) Assert.True(cma.Weights[i] < cma.Weights[i - 1]);
        }
        Assert.Equal(1.0, weightSum, 14); // Hansen 2016, Table 1: Σ wᵢ = 1 over the positive weights

        // μ_eff = (Σw')² / Σw'² (Hansen 2016, eq. 8); hand: Σw'² = 2.90616 + 1.02334 + 0.36741 + 0.10141 + 0.00908
        // = 4.40740, so μ_eff = 3.73625² / 4.40740 = 13.95956 / 4.40740 = 3.16730.
        Assert.Equal(3.16730, cma.MuEff, 4);

        // Table 1, hand-worked with n = 10, μ_eff = 3.16730:
        // c_σ = (μ_eff + 2)/(n + μ_eff + 5) = 5.16730/18.16730 = 0.284429
        Assert.Equal(0.284429, cma.CSigma, 5);
        // d_σ = 1 + 2 max(0, √((μ_eff − 1)/(n + 1)) − 1) + c_σ = 1 + 0 + 0.284429 (√(2.1673/11) = 0.444 < 1)
        Assert.Equal(1.284429, cma.DSigma, 5);
        // c_c = (4 + μ_eff/n)/(n + 4 + 2μ_eff/n) = 4.316730/14.633460 = 0.294990
        Assert.Equal(0.294990, cma.Cc, 5);
        // c₁ = 2/((n + 1.3)² + μ_eff) = 2/(127.69 + 3.16730) = 0.0152838
        Assert.Equal(0.0152838, cma.C1, 6);
        // c_μ = min(1 − c₁, 2(μ_eff − 2 + 1/μ_eff)/((n + 2)² + 2μ_eff/2)) = 2(1.483027)/147.16730 = 0.0201543
        Assert.Equal(0.0201543, cma.CMu, 6);
        // E‖N(0, I)‖ ≈ √10 (1 − 1/40 + 1/2100) = 3.162278 × 0.975476 = 3.084727 (Hansen 2016, p. 30)
        Assert.Equal(3.084727, cma.ExpectedGaussianNorm, 5);
    }

    [Fact]
    public void DiagonalModelIsChosenAutomaticallyAbove200DimensionsAndScalesLearningRates()
    {
        var full = new CmaEvolutionStrategy(new CmaEsSettings(), new double[200], 1);
        var sep = new CmaEvolutionStrategy(new CmaEsSettings(), new double[201], 1);
        var forcedFull = new CmaEvolutionStrategy(new CmaEsSettings(Covariance: CmaCovarianceMode.Full), new double[201], 1);
        Assert.False(full.IsDiagonal);
        Assert.True(sep.IsDiagonal);
        Assert.False(forcedFull.IsDiagonal);
        // Ros & Hansen 2008: the separable model's covariance learning rate is (n + 2)/3 times the full one.
        Assert.Equal(forcedFull.C1 * 203 / 3.0, sep.C1, 15);
        Assert.Equal(forcedFull.CMu * 203 / 3.0, sep.CMu, 15);
    }

    [Fact]
    public void ReachesSphereMinimumInTenDimensions()
    {
        // Hansen 2016 tutorial: CMA-ES with default parameters converges linearly on the sphere;
        // known minimum 0 at the origin.
        double[] x0 = [3, -2, 1, 0.5, -1, 2, -3, 1.5, -0.5, 1];
        var cma = new CmaEvolutionStrategy(new CmaEsSettings(Sigma0: 1.0), x0, seed: 42);
        int used = Minimise(cma, Sphere, maxGenerations: 2000, target: 1e-8);
        Assert.True(-cma.BestFitness < 1e-8, $"best {-cma.BestFitness} after {used} generations");
        Assert.True(used < 2000);
        foreach (double v in cma.Best) Assert.True(Math.Abs(v) < 1e-4);
        Assert.True(Sphere(cma.Center) < 1e-7, $"mean at f = {Sphere(cma.Center)}");
    }

    [Theory]
    [InlineData(7UL)]
    [InlineData(8UL)]
    [InlineData(9UL)]
    public void ReachesRosenbrockMinimumInTenDimensions(ulong seed)
    {
        // Hansen 2016 tutorial (Rosenbrock is its standard non-separable, ill-conditioned test);
        // known minimum 0 at (1, …, 1). Start at the origin, σ₀ = 0.5.
        var cma = new CmaEvolutionStrategy(new CmaEsSettings(Sigma0: 0.5), new double[10], seed);
        int used = Minimise(cma, Rosenbrock, maxGenerations: 5000, target: 1e-8);
        Assert.True(-cma.BestFitness < 1e-8, $"best {-cma.BestFitness} after {used} generations");
        foreach (double v in cma.Best) Assert.True(Math.Abs(v - 1) < 1e-3, $"coordinate {v}");
    }

    [Fact]
    public void SeparableModelSolvesIllConditionedEllipsoid()
    {
        // Ros & Hansen 2008: sep-CMA-ES learns axis scales, so the axis-parallel ellipsoid (condition 10⁶) is
        // solved; known minimum 0 at the origin.
        var cma = new CmaEvolutionStrategy(new CmaEsSettings(Sigma0: 1.0, Covariance: CmaCovarianceMode.Diagonal), Filled(20, 1.0), seed: 3);
        int used = Minimise(cma, Ellipsoid, maxGenerations: 6000, target: 1e-8);
        Assert.True(-cma.BestFitness < 1e-8, $"best {-cma.BestFitness} after {used} generations");
        // The learned variances should follow the axis scales: C₁₁ (flattest axis) ≫ C_nn (steepest axis).
        Assert.True(cma.Covariance(0, 0) > 1e4 * cma.Covariance(19, 19));
    }

    [Fact]
    public void SeparableModelReachesSphereMinimumIn220Dimensions()
    {
        // Known minimum 0 at the origin; Auto selects the separable model above 200 dimensions.
        var cma = new CmaEvolutionStrategy(new CmaEsSettings(Sigma0: 0.2), Filled(220, 0.2), seed: 5);
        Assert.True(cma.IsDiagonal);
        Assert.Equal(20, cma.PopulationSize); // Hansen 2016, Table 1: 4 + ⌊3 ln 220⌋ = 4 + ⌊16.18⌋ = 20
        int used = Minimise(cma, Sphere, maxGenerations: 20000, target: 1e-8);
        Assert.True(-cma.BestFitness < 1e-8, $"best {-cma.BestFitness} after {used} generations");
    }

    [Fact]
    public void EigenBasisReconstructsTheCovarianceAndMatchesMathNet()
    {
        // For n = 10 the lazy-update gap 1/((c₁ + c_μ) n 10) = 0.28 < 1, so C is decomposed after every tell.
        var cma = new CmaEvolutionStrategy(new CmaEsSettings(), Filled(10, 0.0), seed: 11);
        Minimise(cma, Rosenbrock, maxGenerations: 60);
        int n = 10;
        var c = Matrix<double>.Build.Dense(n, n, (i, j) => cma.Covariance(i, j));
        Assert.True(c.Equals(c.Transpose()));
        // C = B D² Bᵀ (Hansen 2016, eq. 6), checked entrywise.
        double scale = c.L2Norm();
        for (int i = 0; i < n; i++)
            for (int j = 0; j < n; j++)
            {
                double s = 0;
                for (int k = 0; k < n; k++) s += cma.EigenBasis[i * n + k] * cma.AxisLengths[k] * cma.AxisLengths[k] * cma.EigenBasis[j * n + k];
                Assert.True(Math.Abs(s - c[i, j]) < 1e-12 * scale, $"({i},{j}): {s} vs {c[i, j]}");
            }
        // Eigenvalues against MathNet.Numerics' dense EVD as reference.
        var reference = c.Evd(Symmetricity.Symmetric).EigenValues.Select(v => v.Real).OrderBy(v => v).ToArray();
        var ours = cma.AxisLengths.ToArray().Select(d => d * d).OrderBy(v => v).ToArray();
        for (int k = 0; k < n; k++) Assert.True(Math.Abs(reference[k] - ours[k]) < 1e-12 * scale);
    }

    [Fact]
    public void StepSizeShrinksOnSphereAndGrowsOnALinearSlope()
    {
        // Hansen 2016, §4 (cumulative step-size adaptation): on a linear function the path lengthens and σ grows;
        // near the optimum of the sphere it shrinks.
        var slope = new CmaEvolutionStrategy(new CmaEsSettings(Sigma0: 1e-3), new double[10], seed: 2);
        Minimise(slope, x => -x[0] - x[1], maxGenerations: 50, target: double.NegativeInfinity);
        Assert.True(slope.StepSize > 1e-2, $"σ = {slope.StepSize}");
        var sphere = new CmaEvolutionStrategy(new CmaEsSettings(Sigma0: 1.0), new double[10], seed: 2);
        Minimise(sphere, Sphere, maxGenerations: 200, target: double.NegativeInfinity);
        Assert.True(sphere.StepSize < 1e-3, $"σ = {sphere.StepSize}");
    }

    [Fact]
    public void RejectsBadSettingsNamingTheKey()
    {
        Assert.Equal("sigma0", Assert.Throws<ArgumentException>(() => new CmaEvolutionStrategy(new CmaEsSettings(Sigma0: 0), new double[3], 1)).ParamName);
        Assert.Equal("population", Assert.Throws<ArgumentException>(() => new CmaEvolutionStrategy(new CmaEsSettings(Population: 1), new double[3], 1)).ParamName);
        Assert.Equal("diagonal_above", Assert.Throws<ArgumentException>(() => new CmaEvolutionStrategy(new CmaEsSettings(DiagonalAbove: 0), new double[3], 1)).ParamName);
        Assert.Equal("covariance", Assert.Throws<ArgumentException>(() => new CmaEvolutionStrategy(new CmaEsSettings(Covariance: (CmaCovarianceMode)9), new double[3], 1)).ParamName);
        Assert.Equal("initialParameters", Assert.Throws<ArgumentException>(() => new CmaEvolutionStrategy(new CmaEsSettings(), [], 1)).ParamName);
    }
}
