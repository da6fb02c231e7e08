namespace PairFit.Core.Copulas;

/// <summary>Independence copula Π(u, v) = uv; density 1, no parameters.</summary>
public sealed class IndependenceLaw : ICopula
{
    public const string FamilyName = "independence";
    public static readonly ICopulaFamily Family = new IndependenceFamily();

    string ICopula.Family => FamilyName;
    public int Rotation => 0;
    public IReadOnlyList<string> ParameterNames => [];
    public IReadOnlyList<double> Parameters => [];
    public double LogDensity(double u, double v) => 0.0;
    public double Cdf(double u, double v) => u * v;
    public double ConditionalCdf(double u, double v) => v;
    public double InverseConditionalCdf(double u, double w) => w;
    public double KendallTau => 0.0;
    public double SpearmanRho => 0.0;
    public double TailLower => 0.0;
    public double TailUpper => 0.0;

    private sealed class IndependenceFamily : ICopulaFamily
    {
        public string Name => FamilyName;
        public IReadOnlyList<string> ParameterNames => [];
        public IReadOnlyList<double> LowerBounds => [];
        public IReadOnlyList<double> UpperBounds => [];
        public IReadOnlyList<int> Rotations => [0];
        public double[]? StartFromTau(double tau) => [];
        public ICopula Create(IReadOnlyList<double> parameters) => new IndependenceLaw();
    }
}
