// Per-dimension max-log LLR demapper for NR 16-QAM (3GPP TS 38.211 5.1.3), synthesizable Verilog-2001.
// One complex sample per clock in, four LLRs per clock out, three registers: input, metrics, output.
// Input: i, q in Q1.6 (8-bit two's complement). Output: llr0..llr3 in Q5.0 (6-bit), llr0 = b0 (I sign),
// llr1 = b1 (Q sign), llr2 = b2 (I magnitude), llr3 = b3 (Q magnitude); L = ln P(b=0) - ln P(b=1).
// Per axis, with inner amplitude A (code A_CODE) and threshold T = 2A, the max-log metrics are
//   sign bit:      m = y                    for |y| <= T,   m = 2y - T*sgn(y)  beyond
//   magnitude bit: m = T - |y|
// and each LLR is round_half_up(m * GAIN / 2^SHIFT) limited to [SAT_LO, SAT_HI] (symmetric saturation).
// The parameters exist so that a test can build deliberately wrong variants; the defaults are the golden model.
module nr16qam_llr #(
    parameter A_CODE = 20,          // round(64 / sqrt(10)): the inner level 1/sqrt(10) in Q1.6
    parameter GAIN = 11,            // 4*A/N0 times the LLR scale, in units of 2^-SHIFT, quantized once
    parameter SHIFT = 4,
    parameter HALF_UP = 1,          // 1: add half an LSB before the shift (half-up); 0: truncate (floor)
    parameter SAT_HI = 31,
    parameter SAT_LO = -31,
    parameter EXTRA_DELAY = 0       // 1: one more output register (a latency the testbench does not expect)
) (
    input  wire        clk,
    input  wire        rst,         // synchronous, active high: clears the pipeline
    input  wire [15:0] iq,          // {i, q}: I in the more significant half
    output wire [23:0] llr          // {llr0, llr1, llr2, llr3}
);
    localparam signed [10:0] T = 2 * A_CODE;

    reg signed [7:0] i_r, q_r;
    reg signed [10:0] mi_sign, mq_sign, mi_mag, mq_mag;
    reg [23:0] out_r, out_d;

    function signed [10:0] sign_metric;
        input signed [7:0] y;
        reg signed [10:0] ye;
        begin
            ye = y;
            if (ye > T)
                sign_metric = 2 * ye - T;
            else if (ye < -T)
                sign_metric = 2 * ye + T;
            else
                sign_metric = ye;
        end
    endfunction

    function signed [10:0] mag_metric;
        input signed [7:0] y;
        reg signed [10:0] ye;
        begin
            ye = y;
            mag_metric = T - (ye < 0 ? -ye : ye);
        end
    endfunction

    function [5:0] scale;
        input signed [10:0] m;
        reg signed [17:0] p;
        reg signed [17:0] r;
        begin
            p = m * GAIN;
            if (HALF_UP)
                r = (p + (1 <<< (SHIFT - 1))) >>> SHIFT;
            else
                r = p >>> SHIFT;
            if (r > SAT_HI)
                r = SAT_HI;
            else if (r < SAT_LO)
                r = SAT_LO;
            scale = r[5:0];
        end
    endfunction

    always @(posedge clk) begin
        if (rst) begin
            i_r <= 8'sd0;
            q_r <= 8'sd0;
            mi_sign <= 11'sd0;
            mq_sign <= 11'sd0;
            mi_mag <= 11'sd0;
            mq_mag <= 11'sd0;
            out_r <= 24'd0;
            out_d <= 24'd0;
        end else begin
            i_r <= iq[15:8];
            q_r <= iq[7:0];
            mi_sign <= sign_metric(i_r);
            mq_sign <= sign_metric(q_r);
            mi_mag <= mag_metric(i_r);
            mq_mag <= mag_metric(q_r);
            out_r <= {scale(mi_sign), scale(mq_sign), scale(mi_mag), scale(mq_mag)};
            out_d <= out_r;
        end
    end

    assign llr = EXTRA_DELAY ? out_d : out_r;
endmodule
