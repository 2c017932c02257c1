// Max-log LLR demapper for NR 16-QAM (3GPP TS 38.211 5.1.3), synthesizable Verilog-2001, written to be bit-exact
// with fixmod's fixed max-log datapath as the committed set vectors/nr-qam16 specifies it (see its manifest.json):
//   input   I, Q codes in Q2.9 (12-bit two's complement); the reference levels +-A1, +-A3 are the Q2.9 codes of
//           1/sqrt(10) and 3/sqrt(10) rounded half-even, as the kernel's reference ROM holds them
//   metric  D = min over points with b=1 of |y-s|^2 - min over points with b=0 of |y-s|^2, exact in integers
//           (18 fractional bits), saturated into Q6.18. The points form a product of two 4-level axes, so the
//           other axis' term is the same in both minima and cancels: D is computed per axis, still exactly.
//   scale   D * K, exact (30 fractional bits), with K = 1/N0 in UQ4.12 as an input (the kernel quantizes it
//           half-even once per noise level; a receiver sets it per block). Fitted into Q7.4: drop 26 bits
//           rounding half-even (ties to the even code), saturate to [-2048, 2047].
//   output  Q5.0: drop 4 bits rounding half-even, symmetric saturation to [-31, 31].
// LLR sign: L = ln P(b=0|y) - ln P(b=1|y). llr = {llr0, llr1, llr2, llr3} = {b0 (I sign), b1 (Q sign),
// b2 (I magnitude), b3 (Q magnitude)}, six bits each, llr0 in the most significant bits.
// Four registers: input, metric, scale, output. The parameters other than the defaults exist so that a test can
// build deliberately wrong variants (see the testbench).
module nr16qam_llr #(
    parameter A1 = 162,             // the inner level 1/sqrt(10) in Q2.9: 161.9 rounded
    parameter A3 = 486,             // the outer level 3/sqrt(10) in Q2.9: 485.7 rounded
    parameter OUT_HALF_EVEN = 1,    // 0: the output stage truncates (floor) instead of rounding half-even
    parameter OUT_MIN = -31,        // the output's lowest code; -32 is plain instead of symmetric saturation
    parameter EXTRA_DELAY = 0       // 1: one more output register (a latency the testbench does not expect)
) (
    input  wire        clk,
    input  wire        rst,         // synchronous, active high: clears the pipeline
    input  wire [23:0] iq,          // {I, Q}: I in the more significant half
    input  wire [15:0] k,           // the scale constant code K (UQ4.12), taken with the sample
    output wire [23:0] llr          // {llr0, llr1, llr2, llr3}
);
    localparam signed [31:0] METRIC_MAX = 32'sd16777215;    // Q6.18: 25-bit codes
    localparam signed [31:0] METRIC_MIN = -32'sd16777216;
    localparam signed [47:0] SCALE_MAX = 48'sd2047;         // Q7.4: 12-bit codes
    localparam signed [47:0] SCALE_MIN = -48'sd2048;
    localparam signed [47:0] OUT_MAX = 48'sd31;             // Q5.0 with symmetric saturation

    reg signed [11:0] i_r, q_r;
    reg [15:0] k_r, k_m;
    reg signed [24:0] m0, m1, m2, m3;
    reg signed [11:0] s0, s1, s2, s3;
    reg [23:0] out_r, out_d;

    function signed [31:0] square;
        input signed [31:0] d;
        begin
            square = d * d;
        end
    endfunction

    function signed [31:0] min2;
        input signed [31:0] a, b;
        begin
            min2 = a < b ? a : b;
        end
    endfunction

    function signed [24:0] fit_metric;
        input signed [31:0] d;
        begin
            if (d > METRIC_MAX)
                fit_metric = METRIC_MAX;
            else if (d < METRIC_MIN)
                fit_metric = METRIC_MIN;
            else
                fit_metric = d;
        end
    endfunction

    // Sign bit of an axis (0: positive coordinate) and magnitude bit (0: inner level).
    function signed [24:0] metric;
        input signed [11:0] y;
        input magnitude;
        reg signed [31:0] ye, dp1, dp3, dm1, dm3;
        begin
            ye = y;
            dp1 = square(ye - A1);
            dp3 = square(ye - A3);
            dm1 = square(ye + A1);
            dm3 = square(ye + A3);
            if (magnitude)
                metric = fit_metric(min2(dp3, dm3) - min2(dp1, dm1));
            else
                metric = fit_metric(min2(dm1, dm3) - min2(dp1, dp3));
        end
    endfunction

    // v / 2^s rounded half-even (ties to the even result), or floor when half_even is 0; s >= 1.
    function signed [47:0] shift_round;
        input signed [47:0] v;
        input integer s;
        input half_even;
        reg signed [47:0] q;
        reg [47:0] r, half;
        begin
            q = v >>> s;
            r = $unsigned(v) & ((48'd1 << s) - 48'd1);
            half = 48'd1 << (s - 1);
            if (half_even && (r > half || (r == half && q[0])))
                q = q + 48'sd1;
            shift_round = q;
        end
    endfunction

    function signed [11:0] scale;
        input signed [24:0] m;
        input [15:0] kc;
        reg signed [47:0] product, p;
        begin
            product = m;
            product = product * $signed({1'b0, kc});
            p = shift_round(product, 26, 1'b1);
            if (p > SCALE_MAX)
                p = SCALE_MAX;
            else if (p < SCALE_MIN)
                p = SCALE_MIN;
            scale = p[11:0];
        end
    endfunction

    function [5:0] out;
        input signed [11:0] s;
        reg signed [47:0] o;
        begin
            o = shift_round(s, 4, OUT_HALF_EVEN);
            if (o > OUT_MAX)
                o = OUT_MAX;
            else if (o < OUT_MIN)
                o = OUT_MIN;
            out = o[5:0];
        end
    endfunction

    always @(posedge clk) begin
        if (rst) begin
            i_r <= 12'sd0;
            q_r <= 12'sd0;
            k_r <= 16'd0;
            k_m <= 16'd0;
            m0 <= 25'sd0;
            m1 <= 25'sd0;
            m2 <= 25'sd0;
            m3 <= 25'sd0;
            s0 <= 12'sd0;
            s1 <= 12'sd0;
            s2 <= 12'sd0;
            s3 <= 12'sd0;
            out_r <= 24'd0;
            out_d <= 24'd0;
        end else begin
            i_r <= iq[23:12];
            q_r <= iq[11:0];
            k_r <= k;
            m0 <= metric(i_r, 1'b0);
            m1 <= metric(q_r, 1'b0);
            m2 <= metric(i_r, 1'b1);
            m3 <= metric(q_r, 1'b1);
            k_m <= k_r;
            s0 <= scale(m0, k_m);
            s1 <= scale(m1, k_m);
            s2 <= scale(m2, k_m);
            s3 <= scale(m3, k_m);
            out_r <= {out(s0), out(s1), out(s2), out(s3)};
            out_d <= out_r;
        end
    end

    assign llr = EXTRA_DELAY ? out_d : out_r;
endmodule
