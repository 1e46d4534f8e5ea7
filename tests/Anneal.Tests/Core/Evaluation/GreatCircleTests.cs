using Anneal.Core.Travel;

namespace Anneal.Tests.Core.Evaluation;

public class GreatCircleTests
{
    [Fact]
    public void Lax_to_jfk_matches_the_aviation_formulary_example()
    {
        // Ed Williams, Aviation Formulary, worked example: LAX (33°57'N, 118°24'W) to JFK (40°38'N, 73°47'W),
        // d = 0.623585 rad = 2144 nm. Values quoted from memory; the formulary states them to 6 decimals, hence 1e-6 rad.
        double km = GreatCircle.Kilometres(33 + (57 / 60.0), -(118 + (24 / 60.0)), 40 + (38 / 60.0), -(73 + (47 / 60.0)));
        double radians = km / GreatCircle.EarthRadiusKm;
        Assert.Equal(0.623585, radians, 1e-6);

        // The formulary's nautical miles: one minute of arc per nm on its sphere (rounded to whole nm there).
        Assert.Equal(2144, radians * 180 * 60 / Math.PI, 0.5);
    }

    [Fact]
    public void One_degree_along_a_meridian_is_r_times_pi_over_180()
    {
        // Arc length s = R * theta (definition); with the IUGG mean radius 6371.0088 km one degree is 111.195 km.
        Assert.Equal(6371.0088 * Math.PI / 180, GreatCircle.Kilometres(10, 20, 11, 20), 1e-9);
        Assert.Equal(0, GreatCircle.Kilometres(48.8, 2.3, 48.8, 2.3));
    }
}
