using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using Monitor.Limits;

namespace Monitor.Limits.Tests;

/// <summary>
/// <see cref="LimitSet.UpdateBooks"/> (book slots, cached scope lists, array reads) against a straightforward model of
/// the same rule written here: store every book's figures, then judge each scope the batch touches once (book scopes in
/// the order given, then desks in the order first touched, then the firm), each active limit in definition order, on
/// the sum over <see cref="BookHierarchy.BooksUnder"/> of <see cref="BookExposures.Get"/>. Random hierarchies, limits
/// (spread-group filters, expired ones), figures as <see cref="MeasureFigures"/> or plain dictionaries, single updates
/// and what-ifs between batches, and a reload that moves books between desks. Changes must be equal, exposures included
/// (the same sums in the same order, so equal bit for bit). Status rule: warning 80%, 5% band (common practice, no source).
/// </summary>
public class LimitSetBatchPropertyTests
{
    private static readonly DateTimeOffset Now = new(2026, 12, 2, 10, 0, 0, TimeSpan.Zero);
    private static readonly ExposureMeasure[] Measures = [ExposureMeasure.MarketValue, ExposureMeasure.Dv01, ExposureMeasure.SpreadLevel];
    private static readonly string[] Groups = ["INDUSTRIAL-A", "UTIL-BBB"];

    [Property(MaxTest = 60)]
    public Property Batches_give_the_changes_statuses_and_sums_of_the_straightforward_rule() =>
        Prop.ForAll(Arb.From(Gen.Choose(0, int.MaxValue)), seed =>
        {
            var random = new Random(seed);
            var hierarchy = RandomHierarchy(random, out var books);
            var limits = RandomLimits(random, hierarchy, books);
            var set = new LimitSet(hierarchy, limits);
            var model = new Model(hierarchy, limits);
            for (var step = 0; step < 12; step++)
            {
                if (step == 8)
                {
                    // Reload: the same books shuffled over the desks; statuses kept, scopes judged again.
                    hierarchy = RandomHierarchy(random, books, hierarchy.Desks.Count());
                    var reload = set.Reload(hierarchy, limits, Now);
                    model.Reload(hierarchy);
                    Assert.Equal(model.JudgeAll(), reload.StatusChanges);
                }

                var batch = Enumerable.Range(0, random.Next(0, books.Length + 3))
                    .Select(_ => (books[random.Next(books.Length)], RandomFigures(random))).ToArray();
                Assert.Equal(model.Batch(batch), set.UpdateBooks(batch, Now));
                if (random.Next(3) == 0)
                {
                    var (book, figures) = (books[random.Next(books.Length)], RandomFigures(random));
                    Assert.Equal(model.WhatIf(book, figures), set.WhatIf(book, figures, Now));
                    Assert.Equal(model.Batch([(book, figures)]), set.UpdateBook(book, figures, Now));
                }

                foreach (var limit in limits)
                {
                    Assert.Equal(model.Status[limit.Id], set.StatusOf(limit.Id));
                    Assert.Equal(model.Exposure(limit.Scope, limit.Measure, limit.SpreadGroup), set.ExposureOf(limit.Scope, limit.Measure, limit.SpreadGroup));
                }
                foreach (var book in books)
                {
                    double? expected = model.Figures.TryGetValue(book, out var f) && f.Totals.TryGetValue(ExposureMeasure.Dv01, out var e) ? e : null;
                    Assert.Equal(expected, set.ExposuresOf(book).TryGetValue(ExposureMeasure.Dv01, out var v) ? v : null);
                }
            }
            return true;
        });

    private static BookHierarchy RandomHierarchy(Random random, out string[] books)
    {
        books = [.. Enumerable.Range(0, random.Next(1, 12)).Select(b => $"book-{b}")];
        return RandomHierarchy(random, books, random.Next(1, 4));
    }

    private static BookHierarchy RandomHierarchy(Random random, string[] books, int deskCount)
    {
        var desks = Enumerable.Range(0, deskCount).ToDictionary(d => $"desk-{d}", _ => new List<string>(), StringComparer.Ordinal);
        foreach (var book in books.OrderBy(_ => random.Next()))
        {
            desks[$"desk-{random.Next(desks.Count)}"].Add(book);
        }
        return new BookHierarchy("firm", desks.ToDictionary(d => d.Key, d => (IReadOnlyList<string>)d.Value, StringComparer.Ordinal));
    }

    private static List<LimitDefinition> RandomLimits(Random random, BookHierarchy hierarchy, string[] books)
    {
        var scopes = books.Select(LimitScope.Book).Concat(hierarchy.Desks.Select(LimitScope.Desk)).Append(LimitScope.Firm("firm")).ToArray();
        return [.. Enumerable.Range(0, random.Next(1, 3 * scopes.Length)).Select(i => new LimitDefinition
        {
            Id = $"limit-{i}",
            Scope = scopes[random.Next(scopes.Length)],
            Measure = Measures[random.Next(Measures.Length)],
            Upper = random.Next(50, 400),
            Lower = random.Next(2) == 0 ? null : -random.Next(50, 400),
            WarningFraction = 0.8,
            HysteresisFraction = 0.05,
            SpreadGroup = random.Next(3) == 0 ? Groups[random.Next(Groups.Length)] : null,
            ExpiresAt = random.Next(6) == 0 ? Now.AddHours(-1) : null,
        })];
    }

    private static BookExposures RandomFigures(Random random)
    {
        double Figure() => Math.Round((random.NextDouble() - 0.3) * 200, 3);
        IReadOnlyDictionary<ExposureMeasure, double> Totals() => random.Next(2) == 0
            ? new MeasureFigures(_ => Figure())
            : Measures.Where(_ => random.Next(4) > 0).ToDictionary(m => m, _ => Figure());
        var groups = Groups.Where(_ => random.Next(3) == 0).ToDictionary(g => g, _ => Totals(), StringComparer.Ordinal);
        return new BookExposures { Totals = Totals(), BySpreadGroup = groups };
    }

    /// <summary>The rule as written in LimitSet's documentation, with plain dictionaries and lists.</summary>
    private sealed class Model(BookHierarchy hierarchy, List<LimitDefinition> limits)
    {
        private BookHierarchy _hierarchy = hierarchy;

        public Dictionary<string, BookExposures> Figures { get; } = new(StringComparer.Ordinal);

        public Dictionary<string, LimitStatus> Status { get; } = limits.ToDictionary(l => l.Id, _ => LimitStatus.Within, StringComparer.Ordinal);

        public void Reload(BookHierarchy hierarchy) => _hierarchy = hierarchy;

        public double Exposure(LimitScope scope, ExposureMeasure measure, string? group)
        {
            var sum = 0.0;
            foreach (var book in _hierarchy.BooksUnder(scope))
            {
                if (Figures.TryGetValue(book, out var figures))
                {
                    sum += figures.Get(measure, group);
                }
            }
            return sum;
        }

        public List<LimitStatusChange> Batch(IReadOnlyList<(string Book, BookExposures Figures)> batch)
        {
            foreach (var (book, figures) in batch)
            {
                Figures[book] = Copy(figures);
            }
            var scopes = batch.Select(u => LimitScope.Book(u.Book))
                .Concat(batch.Select(u => LimitScope.Desk(_hierarchy.DeskOf(u.Book))))
                .Concat(batch.Take(1).Select(_ => LimitScope.Firm(_hierarchy.FirmId)))
                .Distinct();
            return Judge(scopes, commit: true);
        }

        public List<LimitStatusChange> WhatIf(string book, BookExposures figures)
        {
            var had = Figures.GetValueOrDefault(book);
            Figures[book] = Copy(figures);
            var changes = Judge(_hierarchy.ScopesCovering(book), commit: false);
            if (had is null)
            {
                Figures.Remove(book);
            }
            else
            {
                Figures[book] = had;
            }
            return changes;
        }

        public List<LimitStatusChange> JudgeAll() => Judge(limits.Select(l => l.Scope).Distinct(), commit: true);

        private List<LimitStatusChange> Judge(IEnumerable<LimitScope> scopes, bool commit)
        {
            var changes = new List<LimitStatusChange>();
            foreach (var scope in scopes)
            {
                foreach (var limit in limits.Where(l => l.Scope == scope && l.IsActiveAt(Now)))
                {
                    if (LimitEvaluator.Evaluate(limit, Status[limit.Id], Exposure(scope, limit.Measure, limit.SpreadGroup)) is { } change)
                    {
                        changes.Add(change);
                        if (commit)
                        {
                            Status[limit.Id] = change.Current;
                        }
                    }
                }
            }
            return changes;
        }

        private static BookExposures Copy(BookExposures figures) => new()
        {
            Totals = new Dictionary<ExposureMeasure, double>(figures.Totals),
            BySpreadGroup = figures.BySpreadGroup.ToDictionary(g => g.Key, g => (IReadOnlyDictionary<ExposureMeasure, double>)new Dictionary<ExposureMeasure, double>(g.Value), StringComparer.Ordinal),
        };
    }
}
