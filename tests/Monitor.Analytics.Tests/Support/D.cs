namespace Monitor.Analytics.Tests.Support;

/// <summary>Short date constructor for test tables.</summary>
internal static class D
{
    public static DateOnly Ymd(int year, int month, int day) => new(year, month, day);
}
