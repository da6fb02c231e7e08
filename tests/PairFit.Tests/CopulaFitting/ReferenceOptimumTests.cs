using PairFit.Core.Copulas;
using PairFit.Core.Copulas.Fitting;
using PairFit.Core.Dependence;

namespace PairFit.Tests.CopulaFitting;

/// <summary>
/// Maximum pseudo-likelihood optima against SciPy 1.10.1 via Reference/CopulaFitting/make_reference.py,
/// which writes the log densities independently from Nelsen (2006) / Joe (2014) and optimises by a dense
/// grid then SciPy's bounded scalar minimiser (Nelder–Mead from nine starts for Student t).
/// Rows whose family is not (yet) registered, or whose reference optimum lies outside the family's
/// documented range, are left out; the test insists that at least the Clayton rows ran.
/// </summary>
public class ReferenceOptimumTests
{
    public static TheoryData<string> Datasets => new() { "positive", "negative", "heavy" };

    [Theory]
    [MemberData(nameof(Datasets))]
    public void OptimaReachTheReferenceAndStandardErrorsAgree(string dataset)
    {
        var sample = FittingTestData.ReadCsv($"data_{dataset}.csv");
        var rows = FittingTestData.ReadOptima().Where(r => r.Dataset == dataset).ToList();
        int checkedRows = 0;
        foreach (var r in rows)
        {
            var family = FittingTestData.TryFamily(r.Family);
            if (family is null || !WithinRange(family, r.Parameters)) continue;
            var result = CopulaAnalysis.Fit(sample, null, null, new CopulaOptions { Families = [family.Name], GofReplicates = 0 });
            var c = Assert.Single(result.Section.Candidates, k => k.Rotation == r.Rotation);
            string label = $"{dataset} {r.Family} {r.Rotation}";

            // "Fitted optima at least as high as the reference's minus 1e-6" (issue 4).
            Assert.True(c.LogLikelihood >= r.LogLikelihood - 1e-6, $"{label}: logLik {c.LogLikelihood:R} < reference {r.LogLikelihood:R} - 1e-6");
            Assert.True(c.Converged, label + ": " + c.Note);
            for (int i = 0; i < r.ParameterNames.Length; i++)
            {
                double est = c.Parameters[r.ParameterNames[i]], se = r.StandardErrors[i];
                // Near the optimum ℓ drops by ½(Δθ/se)², so a 1e-6 tie in ℓ allows Δθ ≈ 1.4e-3 se; 0.02 se leaves room for
                // the Student t's flat ν direction where both Nelder–Mead runs stop on their own tolerance.
                Assert.True(Math.Abs(est - r.Parameters[i]) <= 0.02 * se, $"{label}: {r.ParameterNames[i]} {est:R} vs reference {r.Parameters[i]:R}");
                // Both sides take central second differences (ours in free coordinates, the reference's in natural
                // ones, step errors ~1e-5 relative); the Student t's ν is read at two slightly different optima: 2 %.
                double? ours = c.StandardErrors[r.ParameterNames[i]];
                Assert.NotNull(ours);
                double tol = r.Family == "student-t" ? 0.02 : 2e-3;
                Assert.True(Math.Abs(ours!.Value / se - 1) <= tol, $"{label}: se({r.ParameterNames[i]}) {ours:R} vs reference {se:R}");
            }
            checkedRows++;
        }
        Assert.True(checkedRows >= (dataset == "heavy" ? 1 : 2), $"only {checkedRows} reference rows of '{dataset}' could be checked");
    }

    [Fact]
    public void LogLikelihoodAtTheReferenceOptimumMatchesScipy()
    {
        // Pseudo-observations (our ranks) and the summed log density at SciPy's optimum: equal to the reference's
        // maximum to ~1e-10 relative (both sum 400 terms of size ~1 in double precision; see below for Student t).
        foreach (var dataset in new[] { "positive", "negative", "heavy" })
        {
            var sample = FittingTestData.ReadCsv($"data_{dataset}.csv");
            double[] u = Ranks.PseudoObservations(sample.X), v = Ranks.PseudoObservations(sample.Y);
            foreach (var r in FittingTestData.ReadOptima().Where(r => r.Dataset == dataset))
            {
                var family = FittingTestData.TryFamily(r.Family);
                if (family is null || !WithinRange(family, r.Parameters)) continue;
                var copula = RotatedCopula.Rotate(family.Create(r.Parameters), r.Rotation);
                double ll = CopulaLogLikelihood.Sum(copula, u, v);
                // Student t goes through an iterated t quantile and the regularized incomplete beta (SciPy's and ours),
                // each good to ~1e-12 relative per point; over 400 terms that is ~1e-10 relative, seen 2e-10: allow 1e-9.
                double tolerance = r.Family == "student-t" ? 1e-9 : 1e-10;
                Assert.True(Math.Abs(ll - r.LogLikelihood) <= tolerance * Math.Max(1, Math.Abs(r.LogLikelihood)),
                    $"{dataset} {r.Family} {r.Rotation}: {ll:R} vs {r.LogLikelihood:R}");
            }
        }
    }

    private static bool WithinRange(ICopulaFamily family, double[] p)
    {
        for (int i = 0; i < p.Length; i++)
            if (p[i] <= family.LowerBounds[i] || p[i] >= family.UpperBounds[i]) return false;
        return true;
    }
}
