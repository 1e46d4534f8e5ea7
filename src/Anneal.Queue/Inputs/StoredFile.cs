namespace Anneal.Queue.Inputs;

/// <summary>One file of a job's input as the database keeps it: its path within the job ('/'-separated) and its bytes.</summary>
public sealed record StoredFile(string Path, byte[] Content);
