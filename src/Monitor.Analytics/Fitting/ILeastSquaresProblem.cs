namespace Monitor.Analytics.Fitting;

/// <summary>
/// A weighted least-squares problem over a curve's parameters: residuals of the active points
/// (yield-like decimals) and their analytic Jacobian, written into caller-owned buffers.
/// </summary>
internal interface ILeastSquaresProblem
{
    CurveModel Model { get; }

    int ParameterCount { get; }

    /// <summary>All points, active or not.</summary>
    int PointCount { get; }

    /// <summary>Points currently in the fit.</summary>
    int ActiveCount { get; }

    string PointId(int point);

    /// <summary>Takes a point in or out of the fit.</summary>
    void SetActive(int point, bool active);

    bool IsActive(int point);

    /// <summary>
    /// Residuals of the active points into r (length ActiveCount) and, unless <paramref name="jacobian"/>
    /// is empty, dr/dp row-major (ActiveCount x ParameterCount).
    /// </summary>
    void Evaluate(ReadOnlySpan<double> p, Span<double> r, Span<double> jacobian);

    /// <summary>Residual of one point (active or not), decimals of yield.</summary>
    double Residual(ReadOnlySpan<double> p, int point);

    /// <summary>Residuals of all points (active or not) in one pass, decimals of yield.</summary>
    void AllResiduals(ReadOnlySpan<double> p, Span<double> residuals);

    /// <summary>A rough (time, zero or spread rate) per active point for the linear cold start.</summary>
    void RateProxies(Span<double> times, Span<double> rates);
}
