using System.Text;
using Monitor.Service.Audit;
using Monitor.Service.Storage;

namespace Monitor.Service.Tests.Audit;

public class HmacSha256VectorTests
{
    // RFC 4231 (2005), section 4.3 "Test Case 2": key "Jefe", data "what do ya want for nothing?".
    [Fact]
    public void Mac_is_the_RFC_4231_test_case_2_vector() =>
        Assert.Equal(
            "5bdcc146bf60754e6a042426089575c75a003f089d2739839dec58b964ec3843",
            RecordKey.FromBytes(Encoding.ASCII.GetBytes("Jefe"), "RFC 4231").Mac(Encoding.ASCII.GetBytes("what do ya want for nothing?")));

    // RFC 4231 (2005), section 4.2 "Test Case 1": key 20 bytes of 0x0b, data "Hi There".
    [Fact]
    public void Mac_is_the_RFC_4231_test_case_1_vector() =>
        Assert.Equal(
            "b0344c61d8db38535ca8afceaf0bf12b881dc200c9833da726e9376c2e32cff7",
            RecordKey.FromBytes(Enumerable.Repeat((byte)0x0b, 20).ToArray(), "RFC 4231").Mac(Encoding.ASCII.GetBytes("Hi There")));

    [Fact]
    public void Genesis_is_64_zeros() => Assert.Equal(new string('0', 64), ExposureLogMac.Genesis);

    [Fact]
    public void A_key_shorter_than_32_characters_is_refused()
    {
        var ex = Assert.Throws<ArgumentException>(() => RecordKey.FromText("short", "a test"));
        Assert.Contains("at least 32", ex.Message, StringComparison.Ordinal);
    }
}
