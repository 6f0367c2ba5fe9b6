package org.leadline.bench.jmh_generated;
public class RayTableBenchmark_jmhType extends RayTableBenchmark_jmhType_B3 {
}

