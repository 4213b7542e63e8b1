using System.Net.Mime;
using System.Text;
using MassTransit;
using MassTransit.Serialization;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.Hosting;
using Monitor.Service.Hosting;
using Monitor.Service.Messaging;
using Monitor.Service.Tests.Support;

namespace Monitor.Service.Tests.Hosting;

/// <summary>
/// Inbound bodies above <c>Transport:MaxMessageBytes</c> (default 64 KiB) are refused before MassTransit parses them:
/// found on the landed main, a 60 MB quote took memory from 96 to 458 MB before its refusal, and a quote with an extra
/// 2-million-element array member was accepted, memory staying above 860 MB.
/// </summary>
public sealed class InboundSizeTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public async Task A_quote_with_a_two_million_element_unknown_member_is_refused_unread_with_its_size_and_the_limit()
    {
        await using var service = await ServiceUnderTest.StartAsync();
        var faults = new ReceiveFaults();
        service.Harness.Bus.ConnectReceiveObserver(faults);
        var quote = new PaddedQuote { QuoteId = "Q-BIG", Padding = new int[2_000_000] };

        await SendPlainJson(service, InboundEndpoints.Quotes, quote);

        await ServiceUnderTest.WaitUntilAsync(() => faults.All.Count > 0, "the refusal");
        var refusal = Assert.IsType<MessageRejectedException>(Assert.Single(faults.All).Exception);
        Assert.Equal("body", refusal.Field);
        Assert.Contains("65536 bytes", refusal.Message, StringComparison.Ordinal);
        Assert.Contains("Transport:MaxMessageBytes", refusal.Message, StringComparison.Ordinal);
        Assert.True(long.Parse(refusal.Value!.Split(' ')[0], System.Globalization.CultureInfo.InvariantCulture) > 4_000_000, refusal.Value);
        Assert.False(await service.Harness.Consumed.Any<Monitor.Contracts.V1.BondQuoted>());
    }

    [Fact]
    public async Task An_oversized_trade_changes_no_book()
    {
        await using var service = await ServiceUnderTest.StartAsync();
        var faults = new ReceiveFaults();
        service.Harness.Bus.ConnectReceiveObserver(faults);
        var before = await service.StateAsync();
        var trade = new PaddedTrade { Note = new string('x', 70_000) };

        await SendPlainJson(service, InboundEndpoints.Trades, trade);

        await ServiceUnderTest.WaitUntilAsync(() => faults.All.Count > 0, "the refusal");
        Assert.IsType<MessageRejectedException>(Assert.Single(faults.All).Exception);
        Assert.Equal(before, await service.StateAsync());
        // The same trade without its extra member is applied: only the size refused it.
        await SendPlainJson(service, InboundEndpoints.Trades, trade with { Note = "small" });
        await ServiceUnderTest.WaitUntilAsync(async () => await service.Pipeline.ReadAsync(e => e.Books["RATES-CORE"].Positions.GetValueOrDefault("VGB-2034-11")) == 2_000_000, "trade applied");
    }

    [Fact]
    public async Task A_quote_with_a_small_unknown_member_is_accepted()
    {
        await using var service = await ServiceUnderTest.StartAsync();
        var faults = new ReceiveFaults();
        service.Harness.Bus.ConnectReceiveObserver(faults);
        await SendPlainJson(service, InboundEndpoints.Quotes, new PaddedQuote { QuoteId = "Q-SMALL", Padding = new int[1_000] });

        await ServiceUnderTest.WaitUntilAsync(() => faults.All.Count > 0
            || service.Harness.Consumed.Select<Monitor.Contracts.V1.BondQuoted>().Any(x => x.Context.Message.QuoteId == "Q-SMALL"), "the quote consumed");
        Assert.Empty(faults.All);
    }

    [Fact]
    public void An_oversized_body_never_reaches_the_parser()
    {
        var inner = new CountingDeserializer();
        var checkedDeserializer = new SizeCheckedDeserializer(inner, 1024);

        var ex = Assert.Throws<MessageRejectedException>(() => checkedDeserializer.Deserialize(new BytesMessageBody(new byte[1025]), EmptyHeaders.Instance));
        Assert.Equal("body: '1025 bytes' is above the limit of 1024 bytes (Transport:MaxMessageBytes); refused unread.", ex.Message);
        Assert.Equal(0, inner.Calls);

        checkedDeserializer.Deserialize(new BytesMessageBody(Encoding.UTF8.GetBytes("{}")), EmptyHeaders.Instance);
        Assert.Equal(1, inner.Calls);
    }

    [Theory]
    [InlineData("0")]
    [InlineData("1023")]
    [InlineData("67108865")]
    public async Task A_size_limit_out_of_range_stops_the_start_naming_the_key(string value)
    {
        var settings = ServiceUnderTest.Settings(_folder.Combine("log"));
        settings["Transport:MaxMessageBytes"] = value;
        var ex = await StartFails(settings);
        Assert.Contains("Transport:MaxMessageBytes: " + value, ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("Transport:ErrorQueueMaxMessages", "0")]
    [InlineData("Transport:ErrorQueueMaxAge", "00:00:10")]
    [InlineData("Transport:ErrorQueueMaxAge", "400.00:00:00")]
    public async Task An_error_queue_bound_out_of_range_stops_the_start_naming_the_key(string key, string value)
    {
        var settings = ServiceUnderTest.Settings(_folder.Combine("log"));
        settings[key] = value;
        var ex = await StartFails(settings);
        Assert.Contains(key + ": ", ex.Message, StringComparison.Ordinal);
    }

    private static async Task<Exception> StartFails(Dictionary<string, string?> settings)
    {
        var configuration = new ConfigurationBuilder().AddInMemoryCollection(settings).Build();
        var builder = Host.CreateEmptyApplicationBuilder(new HostApplicationBuilderSettings());
        builder.Services.AddMonitorService(configuration);
        using var host = builder.Build();
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(30));
        return await Assert.ThrowsAnyAsync<Exception>(() => host.StartAsync(timeout.Token));
    }

    private static async Task SendPlainJson<T>(ServiceUnderTest service, string queue, T message)
        where T : class
    {
        var endpoint = await service.Harness.Bus.GetSendEndpoint(new Uri("queue:" + queue));
        await endpoint.Send(message, ctx => ctx.Serializer = ctx.Serialization.GetMessageSerializer(new ContentType("application/json")));
    }

    /// <summary>A BondQuoted with a member no contract has.</summary>
    public sealed record PaddedQuote
    {
        public required string QuoteId { get; init; }
        public string InstrumentId { get; init; } = "VGB-2034-11";
        public double MidCleanPrice { get; init; } = 100;
        public DateTimeOffset QuoteTime { get; init; } = TestMarket.Now.AddMinutes(-1);
        public string Source { get; init; } = "test";
        public required int[] Padding { get; init; }
    }

    /// <summary>A TradeBooked with a member no contract has.</summary>
    public sealed record PaddedTrade
    {
        public string TradeId { get; init; } = "BIG-1";
        public int Version { get; init; } = 1;
        public string Action { get; init; } = "new";
        public string Book { get; init; } = "RATES-CORE";
        public string InstrumentId { get; init; } = "VGB-2034-11";
        public double FaceAmount { get; init; } = 2_000_000;
        public double CleanPrice { get; init; } = 100;
        public DateTimeOffset TradeTime { get; init; } = TestMarket.Now.AddMinutes(-1);
        public required string Note { get; init; }
    }

    private sealed class CountingDeserializer : IMessageDeserializer
    {
        public int Calls { get; private set; }

        public ContentType ContentType { get; } = new("application/json");

        public void Probe(ProbeContext context)
        {
        }

        public ConsumeContext Deserialize(ReceiveContext receiveContext) => throw new NotSupportedException();

        public SerializerContext Deserialize(MessageBody body, Headers headers, Uri? destinationAddress = null)
        {
            Calls++;
            return null!;
        }

        public MessageBody GetMessageBody(string text) => throw new NotSupportedException();
    }
}
