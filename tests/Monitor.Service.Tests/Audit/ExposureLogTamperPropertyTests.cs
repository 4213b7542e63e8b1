using FsCheck;
using FsCheck.Xunit;
using Monitor.Service.Audit;
using Monitor.Service.Tests.Support;
using static Monitor.Service.Tests.Audit.ExposureLogTestData;

namespace Monitor.Service.Tests.Audit;

/// <summary>Any change of any single byte of a day file is found by the verifier.</summary>
public sealed class ExposureLogTamperPropertyTests : IDisposable
{
    private readonly TempFolder _folder = new();
    private readonly byte[] _original;
    private readonly string _path;

    public ExposureLogTamperPropertyTests()
    {
        var clock = Clock();
        using (var writer = new ExposureLogWriter(TestKey.Value, Options(_folder.Path), clock))
        {
            for (var i = 1; i <= 4; i++)
            {
                writer.Append(ExposureLogKinds.Snapshot, clock.GetUtcNow(), Cause(i), Figures(i));
            }
        }

        _path = ExposureLogFiles.PathOf(_folder.Path, new DateOnly(2026, 12, 1));
        _original = File.ReadAllBytes(_path);
    }

    [Property(MaxTest = 200)]
    public bool Changing_any_byte_is_detected(NonNegativeInt position, byte value)
    {
        var index = position.Get % _original.Length;
        if (_original[index] == value)
        {
            return true; // not a change
        }

        var tampered = (byte[])_original.Clone();
        tampered[index] = value;
        File.WriteAllBytes(_path, tampered);
        try
        {
            return !ExposureLogVerifier.VerifyFile(TestKey.Value, _path).Intact;
        }
        finally
        {
            File.WriteAllBytes(_path, _original);
        }
    }

    [Fact]
    public void The_untouched_file_is_intact() => Assert.True(ExposureLogVerifier.VerifyFile(TestKey.Value, _path).Intact);

    public void Dispose() => _folder.Dispose();
}
