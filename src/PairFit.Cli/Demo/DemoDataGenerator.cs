using System.Globalization;
using System.Text;
using MathNet.Numerics.Distributions;
using PairFit.Core.Common;
using PairFit.Core.Copulas;
using PairFit.Core.Marginals;

namespace PairFit.Cli.Demo;

/// <summary>
/// Writes the built-in demo data: two invented, labelled-synthetic scenarios drawn from known
/// joint laws with a fixed seed, so that anyone can regenerate them byte for byte
/// (`pairfit generate-demo-data --out data-demo`) and so that tests know the truth behind them.
/// The scenarios, their columns and units are described in data-demo/README.md.
/// </summary>
public static class DemoDataGenerator
{
    public const int Seed = 20261202;
    public const string StormFile = "storm-events.csv";
    public const string LossFile = "loss-lines.csv";

    // Storm events at a fictional catchment: rainfall depth ~ gamma(shape 1.6, scale 14 mm),
    // runoff depth ~ lognormal(mu = ln 5, sigma = 0.85) mm, coupled by a survival (180°) Clayton
    // copula with theta = 2.5 (Kendall's tau = 0.556, upper tail dependence 2^(-1/2.5) = 0.758):
    // the largest storms almost always give the largest runoff.
    public const int StormEvents = 3000;
    public const double RainShape = 1.6, RainScale = 14.0;
    public static readonly double RunoffMu = Math.Log(5.0);
    public const double RunoffSigma = 0.85, StormTheta = 2.5;

    // Scenario-year losses of two fictional business lines (million currency units):
    // line A ~ lognormal(mu = ln 40, sigma = 0.5), line B ~ gamma(shape 2.2, scale 11),
    // survival Clayton theta = 1.2 (tau = 0.375): joint bad years cluster in the upper tail.
    public const int LossYears = 2000;
    public static readonly double LineAMu = Math.Log(40.0);
    public const double LineASigma = 0.5, LineBShape = 2.2, LineBScale = 11.0, LossTheta = 1.2;

    public static IReadOnlyList<string> Write(string folder)
    {
        Directory.CreateDirectory(folder);
        var written = new List<string>();
        string storm = Path.Combine(folder, StormFile);
        File.WriteAllText(storm, StormCsv());
        written.Add(storm);
        string loss = Path.Combine(folder, LossFile);
        File.WriteAllText(loss, LossCsv());
        written.Add(loss);
        return written;
    }

    public static string StormCsv()
    {
        var rng = RandomStreams.For(Seed, 1);
        var copula = RotatedCopula.Rotate(new ClaytonLaw(StormTheta), 180);
        var runoff = new LogNormalDistribution(RunoffMu, RunoffSigma);
        var sb = new StringBuilder("event_id,season,rainfall_mm,runoff_mm\n");
        var start = new DateOnly(2001, 1, 1);
        for (int i = 0; i < StormEvents; i++)
        {
            double u = RandomStreams.OpenUniform(rng), w = RandomStreams.OpenUniform(rng);
            double v = copula.InverseConditionalCdf(u, w);
            double rain = Gamma.InvCDF(RainShape, 1.0 / RainScale, u);
            double run = runoff.Quantile(v);
            var day = start.AddDays((int)(i * 365.25 * 25 / StormEvents));
            string season = day.Month is >= 4 and <= 9 ? "summer" : "winter";
            // Gauge gaps, as real records have them: a blank runoff cell (about 1 %), the logger's
            // -9999 sentinel (about 0.5 %) and "NA" rainfall (about 0.3 %). Each is counted when read.
            double g = rng.NextDouble();
            string rainText = g < 0.003 ? "NA" : rain.ToString("0.0", CultureInfo.InvariantCulture);
            string runText = g is >= 0.003 and < 0.013 ? "" : g is >= 0.013 and < 0.018 ? "-9999" : run.ToString("0.00", CultureInfo.InvariantCulture);
            sb.Append(CultureInfo.InvariantCulture, $"E{i + 1:00000},{season},{rainText},{runText}\n");
        }
        return sb.ToString();
    }

    public static string LossCsv()
    {
        var rng = RandomStreams.For(Seed, 2);
        var copula = RotatedCopula.Rotate(new ClaytonLaw(LossTheta), 180);
        var lineA = new LogNormalDistribution(LineAMu, LineASigma);
        var sb = new StringBuilder("scenario_year,line_a_loss_millions,line_b_loss_millions\n");
        for (int i = 0; i < LossYears; i++)
        {
            double u = RandomStreams.OpenUniform(rng), w = RandomStreams.OpenUniform(rng);
            double v = copula.InverseConditionalCdf(u, w);
            double a = lineA.Quantile(u);
            double b = Gamma.InvCDF(LineBShape, 1.0 / LineBScale, v);
            sb.Append(CultureInfo.InvariantCulture, $"{i + 1},{a:0.000},{b:0.000}\n");
        }
        return sb.ToString();
    }
}
