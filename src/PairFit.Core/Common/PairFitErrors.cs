namespace PairFit.Core.Common;

/// <summary>
/// A problem with what the user gave (a file, a column, an option, a value). The message is one
/// line that names the culprit and says what to do; the command line prints it without a stack
/// trace and exits with code 2.
/// </summary>
public sealed class PairFitInputException(string message) : Exception(message);

/// <summary>
/// The input was valid but the analysis could not be completed (for example every candidate
/// family failed to fit). The command line prints the message and exits with code 1.
/// </summary>
public sealed class PairFitAnalysisException(string message) : Exception(message);
