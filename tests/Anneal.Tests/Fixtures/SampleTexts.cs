namespace Anneal.Tests.Fixtures;

/// <summary>Small hand-written files in the benchmark formats, so reader tests run without ../shared/benchmarks.</summary>
internal static class SampleTexts
{
    public const string Solomon =
        "TINY1\n" +
        "\n" +
        "VEHICLE\n" +
        "NUMBER     CAPACITY\n" +
        "  3         50\n" +
        "\n" +
        "CUSTOMER\n" +
        "CUST NO.  XCOORD.   YCOORD.    DEMAND   READY TIME  DUE DATE   SERVICE   TIME\n" +
        " \n" +
        "    0      0         0          0          0        500          0\n" +
        "    1      0        10         10          0        100         10\n" +
        "    2     10        10         20         50        200         10\n" +
        "    3     10         0         30          0        300         10\n" +
        "    4      5         5         15         20         80          5\n";

    public const string Cvrplib =
        "NAME : tiny-n5\n" +
        "COMMENT : (hand-made sample)\n" +
        "TYPE : CVRP\n" +
        "DIMENSION : 5\n" +
        "EDGE_WEIGHT_TYPE : EUC_2D\n" +
        "CAPACITY : 30\n" +
        "NODE_COORD_SECTION\n" +
        " 1 0 0\n" +
        " 2 3 4\n" +
        " 3 6 8\n" +
        " 4 -3 4\n" +
        " 5 0 10\n" +
        "DEMAND_SECTION\n" +
        "1 0\n" +
        "2 10\n" +
        "3 15\n" +
        "4 5\n" +
        "5 20\n" +
        "DEPOT_SECTION\n" +
        " 1\n" +
        " -1\n" +
        "EOF\n";

    /// <summary>Routes for <see cref="Solomon"/> (ids 1..4).</summary>
    public const string SolomonRoutes =
        "Route #1: 4 1\n" +
        "Route #2: 2 3\n" +
        "Route #3:\n" +
        "Cost 99.9\n";
}
