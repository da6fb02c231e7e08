using PairFit.Figures.Report;

namespace PairFit.Tests.Report;

public class NumberFormatTests
{
    [Theory]
    [InlineData(-11980.531, "-11980.5")]   // a log-likelihood keeps the digits that separate candidates
    [InlineData(23965.062, "23965.1")]
    [InlineData(0.0123456, "0.01235")]
    [InlineData(2.5493778, "2.549")]
    [InlineData(1.5e12, "1.5E+12")]
    [InlineData(double.NaN, "–")]
    public void ReportNumbersKeepUsefulDigitsAndNeverSayNaN(double value, string expected)
        => Assert.Equal(expected, ReportBuilder.Num(value));
}
