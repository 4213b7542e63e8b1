using System.Text;
using Monitor.Service.Audit;

namespace Monitor.Service.Tests.Audit;

public class Sha256VectorTests
{
    // FIPS 180-2 (2002), Appendix B.1 "SHA-256 Example (One-Block Message)": SHA-256("abc").
    [Fact]
    public void Hash_of_abc_is_the_FIPS_180_2_one_block_vector() =>
        Assert.Equal(
            "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad",
            ExposureLogHash.Compute(Encoding.ASCII.GetBytes("abc")));

    // FIPS 180-2 (2002), Appendix B.2 "SHA-256 Example (Multi-Block Message)".
    [Fact]
    public void Hash_of_the_448_bit_message_is_the_FIPS_180_2_multi_block_vector() =>
        Assert.Equal(
            "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1",
            ExposureLogHash.Compute(Encoding.ASCII.GetBytes("abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq")));

    [Fact]
    public void Genesis_is_64_zeros() => Assert.Equal(new string('0', 64), ExposureLogHash.Genesis);
}
