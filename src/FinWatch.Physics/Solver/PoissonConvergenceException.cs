namespace FinWatch.Physics.Solver;

/// <summary>
/// Thrown when the Newton iteration of the 2-D solver does not reach max|δψ| &lt; 1e-8 V within 80 iterations
/// (docs/model.md §F.4: "raise an error, never return silently"), or when an inverse iteration does not converge.
/// </summary>
public sealed class PoissonConvergenceException : Exception
{
    /// <summary>Creates the exception with a default message.</summary>
    public PoissonConvergenceException()
        : base("The 2-D Poisson solve did not converge.")
    {
    }

    /// <summary>Creates the exception with a message.</summary>
    /// <param name="message">What did not converge, with the bias and the last update.</param>
    public PoissonConvergenceException(string message)
        : base(message)
    {
    }

    /// <summary>Creates the exception with a message and an inner exception.</summary>
    /// <param name="message">What did not converge.</param>
    /// <param name="innerException">The cause.</param>
    public PoissonConvergenceException(string message, Exception innerException)
        : base(message, innerException)
    {
    }
}
