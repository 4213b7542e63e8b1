using MassTransit;
using MassTransit.Testing;
using Monitor.Contracts.V1;
using Monitor.Service.Messaging;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Pipeline;

/// <summary>
/// No currency mixed: until several currencies are supported, a bond in another currency than Monitor:ReportingCurrency
/// (XTS in the test market) is refused to the error queue with the field and value, and a trade on it changes nothing.
/// Today's build priced it on the XTS government curve and added it into XTS totals.
/// </summary>
public sealed class ReportingCurrencyTests
{
    [Fact]
    public async Task A_bond_in_another_currency_is_refused_and_a_trade_on_it_changes_nothing()
    {
        await using var service = await ServiceUnderTest.StartAsync();
        await ServiceUnderTest.WaitUntilAsync(() => service.Harness.Published.Select<CurveFitted>().Any(), "opening fit");
        await service.Pipeline.WhenPublishedAsync();
        var before = await service.StateAsync();

        await service.Harness.Bus.Publish(new InstrumentDefined
        {
            InstrumentId = "EUR-2034-11",
            Issuer = "Republic of Examplia",
            Currency = "EUR",
            CouponRate = 0.03,
            Frequency = 1,
            DayCount = "ACT/ACT-ICMA",
            IssueDate = new DateOnly(2024, 11, 15),
            MaturityDate = new DateOnly(2034, 11, 15),
            Face = 100,
            SettlementLagDays = 1,
        });
        Assert.True(await service.Harness.Published.Any<Fault<InstrumentDefined>>());
        var fault = service.Harness.Published.Select<Fault<InstrumentDefined>>().First().Context.Message;
        Assert.Contains("currency: 'EUR'", fault.Exceptions[0].Message, StringComparison.Ordinal);
        Assert.Contains("reporting currency XTS", fault.Exceptions[0].Message, StringComparison.Ordinal);
        Assert.Equal(typeof(MessageRejectedException).FullName, fault.Exceptions[0].ExceptionType);

        await service.Harness.Bus.Publish(ServiceUnderTest.Trade("FX-1", 1, "new", "RATES-CORE", "EUR-2034-11", 1_000_000));
        Assert.True(await service.Harness.Published.Any<Fault<TradeBooked>>(x => x.Context.Message.Message.TradeId == "FX-1"));
        Assert.Equal(before, await service.StateAsync());
    }
}
