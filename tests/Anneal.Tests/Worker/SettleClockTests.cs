using Anneal.Worker;
using Anneal.Worker.Arrival;
using Microsoft.Extensions.Time.Testing;

namespace Anneal.Tests.Worker;

/// <summary>
/// The worker's waits on a FakeTimeProvider, moved by hand, so no test sleeps or reads the wall clock for them: the
/// settle time of an arriving job (a job is claimed once it has looked the same for the whole settle time) and the
/// back-off after a full outbox (5 s, doubling to at most 5 minutes; the rule written in OutboxBackoff).
/// </summary>
public sealed class SettleClockTests : TempFolderTest
{
    [Fact]
    public void A_job_settles_only_after_looking_the_same_for_the_settle_time_counted_from_its_last_change()
    {
        string inbox = Path.Combine(Dir, "inbox");
        string job = Path.Combine(inbox, "job");
        Directory.CreateDirectory(job);
        string stops = Path.Combine(job, "stops.csv");
        File.WriteAllText(stops, "id,x,y\n");
        var clock = new FakeTimeProvider(DateTimeOffset.UtcNow);
        var watch = new SettleWatch(inbox, TimeSpan.FromSeconds(30), requireMarker: false, clock);
        FileSystemInfo[] Entries() => [new DirectoryInfo(job)];

        Assert.Empty(watch.Settled(Entries())); // just written
        clock.Advance(TimeSpan.FromSeconds(20));
        Assert.Empty(watch.Settled(Entries()));

        File.AppendAllText(stops, "s1,1,2\n"); // a change starts the settle time again, from the moment it is seen
        Assert.Empty(watch.Settled(Entries()));
        clock.Advance(TimeSpan.FromSeconds(29));
        Assert.Empty(watch.Settled(Entries()));
        clock.Advance(TimeSpan.FromSeconds(1));
        Assert.Equal(job, Assert.Single(watch.Settled(Entries())).FullName);
    }

    [Fact]
    public void After_a_full_outbox_the_wait_doubles_up_to_five_minutes_and_a_publish_ends_it()
    {
        var clock = new FakeTimeProvider(new DateTimeOffset(2026, 12, 4, 22, 0, 0, TimeSpan.Zero));
        var backoff = new OutboxBackoff();
        Assert.Equal(TimeSpan.FromSeconds(5), backoff.Full(clock.GetUtcNow()));
        clock.Advance(TimeSpan.FromSeconds(4.9));
        Assert.True(backoff.Paused(clock.GetUtcNow()));
        clock.Advance(TimeSpan.FromSeconds(0.1));
        Assert.False(backoff.Paused(clock.GetUtcNow()));

        double[] seconds = [10, 20, 40, 80, 160, 300, 300];
        foreach (double s in seconds)
        {
            Assert.Equal(TimeSpan.FromSeconds(s), backoff.Full(clock.GetUtcNow()));
        }

        Assert.Equal(8, backoff.Unpublished);
        backoff.Published();
        Assert.False(backoff.Paused(clock.GetUtcNow()));
        Assert.Equal(TimeSpan.FromSeconds(5), backoff.Full(clock.GetUtcNow()));
    }
}
