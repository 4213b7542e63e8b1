using Monitor.Analytics.Dates;
using Monitor.Analytics.Instruments;
using static Monitor.Analytics.Tests.Support.D;

namespace Monitor.Analytics.Tests.Instruments;

public class BondValidationTests
{
    private static Bond Make(
        decimal coupon = 0.05m,
        int frequency = 2,
        DateOnly? issue = null,
        DateOnly? firstCoupon = null,
        DateOnly? maturity = null,
        decimal face = 100m,
        int lag = 1,
        string id = "B1",
        string issuer = "Test Issuer",
        string currency = "USD",
        string? spreadGroup = null,
        DayCountConvention dayCount = DayCountConvention.ActActIcma) =>
        new(id, issuer, spreadGroup, currency, coupon, frequency, dayCount, issue ?? Ymd(2020, 1, 15), firstCoupon, maturity ?? Ymd(2030, 1, 15), face, lag);

    public static TheoryData<Func<Bond>, string, string> BadBonds() => new()
    {
        { () => Make(maturity: Ymd(2019, 1, 1)), "MaturityDate", "2019-01-01" },
        { () => Make(maturity: Ymd(2020, 1, 15)), "MaturityDate", "2020-01-15" },
        { () => Make(firstCoupon: Ymd(2020, 1, 15)), "FirstCouponDate", "2020-01-15" },
        { () => Make(firstCoupon: Ymd(2031, 1, 15)), "FirstCouponDate", "2031-01-15" },
        { () => Make(coupon: -0.01m), "CouponRate", "-0.01" },
        { () => Make(coupon: 5m), "CouponRate", "5" },
        { () => Make(frequency: 3), "Frequency", "3" },
        { () => Make(frequency: -2), "Frequency", "-2" },
        { () => Make(frequency: 0, coupon: 0.02m), "CouponRate", "0.02" },
        { () => Make(frequency: 0, coupon: 0m, firstCoupon: Ymd(2021, 1, 15)), "FirstCouponDate", "2021-01-15" },
        { () => Make(face: 0m), "Face", "0" },
        { () => Make(lag: -1), "SettlementLagDays", "-1" },
        { () => Make(id: " "), "Id", "' '" },
        { () => Make(issuer: ""), "Issuer", "''" },
        { () => Make(currency: ""), "Currency", "''" },
        { () => Make(spreadGroup: "  "), "SpreadGroup", "'  '" },
        { () => Make(dayCount: (DayCountConvention)99), "DayCount", "99" },
    };

    [Theory]
    [MemberData(nameof(BadBonds))]
    public void Bad_reference_data_is_rejected_naming_field_and_value(Func<Bond> make, string field, string value)
    {
        // Project rule (DEVELOPERS.md): bad input throws, naming the field and the value.
        var ex = Assert.ThrowsAny<ArgumentException>(make);
        Assert.Contains($"{field} = {value}", ex.Message, StringComparison.Ordinal);
        Assert.Equal(field, ex.ParamName);
    }

    [Fact]
    public void Valid_bond_keeps_its_fields()
    {
        var bond = Make(face: 1000m, lag: 2, spreadGroup: "FIN-A");
        Assert.Equal(1000m, bond.Face);
        Assert.Equal(2, bond.SettlementLagDays);
        Assert.Equal("FIN-A", bond.SpreadGroup);
        Assert.False(bond.IsZeroCoupon);
        Assert.Equal(20, bond.Schedule!.Periods.Count);
    }

    [Fact]
    public void Settlement_outside_the_life_of_the_bond_is_rejected()
    {
        var bond = Make();
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => bond.AccruedInterest(Ymd(2030, 1, 15)));
        Assert.Contains("settlement 2030-01-15", ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(0, true)]
    [InlineData(1, true)]
    [InlineData(2, true)]
    [InlineData(4, true)]
    [InlineData(12, true)]
    [InlineData(3, false)]
    [InlineData(6, false)]
    [InlineData(52, false)]
    public void Coupon_frequencies(int frequency, bool valid)
    {
        Assert.Equal(valid, CouponFrequency.IsValid(frequency));
        if (!valid)
        {
            var ex = Assert.Throws<ArgumentOutOfRangeException>(() => CouponFrequency.Validate(frequency));
            Assert.Contains($"Frequency = {frequency}", ex.Message, StringComparison.Ordinal);
        }
    }
}
