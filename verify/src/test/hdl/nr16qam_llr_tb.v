// Testbench: reads the demapper stimulus with $readmemh (24-bit {I, Q} words of the set's demapper-in.hex) and the
// scale constants K per noise level (+scale: the set's llr-scale.hex, line 0 for the vectors without noise, line
// l + 1 for noise level l), drives one sample per clock and writes the LLR port every clock with $fwrite (one %h word per line, the set's
// llr layout) from the first stimulus cycle on, plus a few flush cycles. The bundled design's latency is therefore
// 3 words. Vector n belongs to noise level n / per_level when n < levels * per_level (the set's manifest: groups,
// demapper, data-per-level and levels); the rest has no noise.
// Plusargs: +stim=FILE +scale=FILE +dump=FILE +count=N +per_level=N +levels=N.
// Variants (for the tests that break it on purpose): -DLLR_TRUNCATE (floor instead of half-even in the output
// stage), -DLLR_EXTRA_LATENCY (one more register), -DLLR_SAT_OFF_BY_ONE (output saturates at -32, not -31).
module nr16qam_llr_tb;
`ifdef LLR_TRUNCATE
    localparam OUT_HALF_EVEN = 0;
`else
    localparam OUT_HALF_EVEN = 1;
`endif
`ifdef LLR_EXTRA_LATENCY
    localparam EXTRA_DELAY = 1;
`else
    localparam EXTRA_DELAY = 0;
`endif
`ifdef LLR_SAT_OFF_BY_ONE
    localparam OUT_MIN = -32;
`else
    localparam OUT_MIN = -31;
`endif
    localparam MAX_VECTORS = 65536;
    localparam MAX_LEVELS = 64;
    localparam FLUSH = 4;

    reg clk = 1'b0;
    reg rst = 1'b1;
    reg [23:0] iq = 24'd0;
    reg [15:0] k = 16'd0;
    wire [23:0] llr;
    reg [23:0] stim [0:MAX_VECTORS - 1];
    reg [15:0] scale [0:MAX_LEVELS];
    reg [1023:0] stim_file, scale_file, dump_file;
    integer count, per_level, levels, n, fd;

    nr16qam_llr #(.OUT_HALF_EVEN(OUT_HALF_EVEN), .OUT_MIN(OUT_MIN), .EXTRA_DELAY(EXTRA_DELAY)) dut (
        .clk(clk), .rst(rst), .iq(iq), .k(k), .llr(llr));

    always #5 clk = ~clk;

    initial begin
        if (!$value$plusargs("stim=%s", stim_file) || !$value$plusargs("scale=%s", scale_file)
                || !$value$plusargs("dump=%s", dump_file) || !$value$plusargs("count=%d", count)
                || !$value$plusargs("per_level=%d", per_level) || !$value$plusargs("levels=%d", levels)) begin
            $display("usage: vvp SIM +stim=FILE +scale=FILE +dump=FILE +count=N +per_level=N +levels=N");
            $finish;
        end
        $readmemh(stim_file, stim, 0, count - 1);
        $readmemh(scale_file, scale, 0, levels);
        fd = $fopen(dump_file, "w");
        repeat (2) @(posedge clk);
        @(negedge clk) rst = 1'b0;
        for (n = 0; n < count + FLUSH; n = n + 1) begin
            iq = n < count ? stim[n] : 24'd0;
            k = n < levels * per_level ? scale[1 + n / per_level] : scale[0];
            @(posedge clk);
            #1 $fwrite(fd, "%h\n", llr);
            @(negedge clk);
        end
        $fclose(fd);
        $finish;
    end
endmodule
