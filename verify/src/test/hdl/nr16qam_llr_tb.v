// Testbench: reads the stimulus with $readmemh, drives one sample per clock and writes the LLR port every clock
// with $fwrite (one %h word per line) from the first stimulus cycle on, plus a few flush cycles. The bundled
// design's latency is therefore 2 words. Plusargs: +stim=FILE +dump=FILE +count=N.
// Variants (for the tests that break it on purpose): -DLLR_TRUNCATE, -DLLR_EXTRA_LATENCY, -DLLR_SAT_OFF_BY_ONE.
module nr16qam_llr_tb;
`ifdef LLR_TRUNCATE
    localparam HALF_UP = 0;
`else
    localparam HALF_UP = 1;
`endif
`ifdef LLR_EXTRA_LATENCY
    localparam EXTRA_DELAY = 1;
`else
    localparam EXTRA_DELAY = 0;
`endif
`ifdef LLR_SAT_OFF_BY_ONE
    localparam SAT_HI = 30;
`else
    localparam SAT_HI = 31;
`endif
    localparam MAX_VECTORS = 65536;
    localparam FLUSH = 4;

    reg clk = 1'b0;
    reg rst = 1'b1;
    reg [15:0] iq = 16'd0;
    wire [23:0] llr;
    reg [15:0] stim [0:MAX_VECTORS - 1];
    reg [1023:0] stim_file, dump_file;
    integer count, n, fd;

    nr16qam_llr #(.HALF_UP(HALF_UP), .EXTRA_DELAY(EXTRA_DELAY), .SAT_HI(SAT_HI)) dut (
        .clk(clk), .rst(rst), .iq(iq), .llr(llr));

    always #5 clk = ~clk;

    initial begin
        if (!$value$plusargs("stim=%s", stim_file) || !$value$plusargs("dump=%s", dump_file)
                || !$value$plusargs("count=%d", count)) begin
            $display("usage: vvp SIM +stim=FILE +dump=FILE +count=N");
            $finish;
        end
        $readmemh(stim_file, stim, 0, count - 1);
        fd = $fopen(dump_file, "w");
        repeat (2) @(posedge clk);
        @(negedge clk) rst = 1'b0;
        for (n = 0; n < count + FLUSH; n = n + 1) begin
            iq = n < count ? stim[n] : 16'd0;
            @(posedge clk);
            #1 $fwrite(fd, "%h\n", llr);
            @(negedge clk);
        end
        $fclose(fd);
        $finish;
    end
endmodule
