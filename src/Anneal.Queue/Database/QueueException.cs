using System.Globalization;

namespace Anneal.Queue.Database;

/// <summary>The queue's database cannot be used as it is: unreachable, without the schema, or at another version. Messages never hold a password.</summary>
public sealed class QueueException : Exception
{
    public QueueException(string message)
        : base(message)
    {
    }

    public QueueException(string message, Exception inner)
        : base(message, inner)
    {
    }

    public QueueException()
        : base("the queue's database cannot be used")
    {
    }

    public static QueueException NoSchema() =>
        new("the database holds no Anneal queue yet: run `anneal queue init --db CONN` once (it is safe to run again)");

    public static QueueException NewerSchema(int found) => new(string.Create(CultureInfo.InvariantCulture,
        $"the database's queue schema is version {found}, newer than this anneal knows ({QueueSchema.Version}): use the anneal release that created it, or a newer one"));

    public static QueueException OlderSchema(int found) => new(string.Create(CultureInfo.InvariantCulture,
        $"the database's queue schema is version {found}, older than this anneal's ({QueueSchema.Version}): run `anneal queue init --db CONN` to migrate it"));
}
