Console.WriteLine("Thermostrat benchmarks");
