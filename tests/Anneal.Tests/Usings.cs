global using Anneal.Tests.Fixtures;
global using Anneal.Tests.Oracles;
global using Xunit;
