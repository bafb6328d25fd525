#!/usr/bin/env bash
# End-to-end test of the explorer in a real terminal (tmux): start the built
# binary at 120×40, change χ with keys and see the threshold and verdict
# text change, type a value over the selected one, switch every view,
# export the state twice (the second time answering the overwrite
# question), open the outflow view (7), step its star-formation rate and
# see the chart redrawn, export it and the carried cloud as figures, load
# the demo simulation outcomes (their glyphs on charts 1
# and 4, the scores in the criteria table) and clear them, resize to 80×24
# (every legend entry, the full-screen chart) and 30×10, quit, and confirm
# the exit status and that the terminal was restored; then run it with
# --ascii and require plain ASCII on screen, outcomes loaded too.
# Usage: .ci/e2e-tmux.sh PATH/TO/cloudwind
set -euo pipefail
bin=$(realpath "$1")
export LANG=C.UTF-8 TERM=xterm-256color
S=cloudwind-e2e-$$
out=$(mktemp -d)
trap 'tmux kill-session -t "$S" 2>/dev/null || true; rm -rf "$out"' EXIT

fail() { echo "e2e: $*"; echo "--- screen:"; tmux capture-pane -p -t "$S" 2>/dev/null || true; exit 1; }
screen() { tmux capture-pane -p -t "$S"; }
# wait_for TEXT: poll the screen (no fixed sleeps) for up to 10 s.
wait_for() {
  for _ in $(seq 1 200); do
    if screen | grep -qF -- "$1"; then return 0; fi
    sleep 0.05
  done
  fail "timed out waiting for: $1"
}
wait_gone() {
  for _ in $(seq 1 200); do
    if ! screen | grep -qF -- "$1"; then return 0; fi
    sleep 0.05
  done
  fail "timed out waiting for this to disappear: $1"
}
# criterion_row LABEL: the criteria-table row of a criterion (by its label).
criterion_row() { screen | grep -F -- "  $1 " | head -1; }

# The shell prints a marker first so that a restored screen can be recognised.
tmux -u new-session -d -s "$S" -x 120 -y 40 \
  "echo SHELL-BEFORE-EXPLORER; '$bin' --chi 100 --mach 1 --radius '5 pc' --cooling builtin; echo \"exit=\$?\" > '$out/status'; sleep 30"
wait_for "Criteria"
wait_for "Gronke & Oh 2018"
before=$(criterion_row "Gronke & Oh 2018")
echo "$before" | grep -q "destroyed" || fail "expected Gronke & Oh 2018 destroyed at χ = 100, r = 5 pc: $before"

# Raise χ by one dex: two coarse steps (each ten fine steps of 0.05 dex).
tmux send-keys -t "$S" S-Right
tmux send-keys -t "$S" S-Right
wait_for "χ        1000"
after=$(criterion_row "Gronke & Oh 2018")
[ "$before" != "$after" ] || fail "the Gronke & Oh 2018 row did not change with χ"
# Enlarge the radius by two dex (four coarse steps of 0.5 dex): the verdict flips to survival.
tmux send-keys -t "$S" Down Down Down Down Down
for _ in 1 2 3 4; do tmux send-keys -t "$S" S-Right; done
wait_for "r_cl     500 pc"
criterion_row "Gronke & Oh 2018" | grep -q "survives" || fail "Gronke & Oh 2018 does not survive at r_cl = 500 pc: $(criterion_row "Gronke & Oh 2018")"
# Typing replaces the selected value (not appended to it), and back to 500 pc.
tmux send-keys -t "$S" Enter; wait_for "typing replaces 500"
tmux send-keys -t "$S" -l "0.2 kpc"; tmux send-keys -t "$S" Enter
wait_for "r_cl     200 pc"
tmux send-keys -t "$S" Enter; tmux send-keys -t "$S" -l "500"; tmux send-keys -t "$S" Enter
wait_for "r_cl     500 pc"

# Export the state; a second export to the same file asks first, naming it in full.
tmux send-keys -t "$S" J; wait_for "export state to"
tmux send-keys -t "$S" -l "$out/state.json"; tmux send-keys -t "$S" Enter
wait_for "exported the state to $out/state.json"
[ -s "$out/state.json" ] || fail "the state export wrote nothing"
tmux send-keys -t "$S" J; wait_for "export state to"
tmux send-keys -t "$S" -l "$out/state.json"; tmux send-keys -t "$S" Enter
wait_for "overwrite the existing file?"; wait_for "$out/state.json"
tmux send-keys -t "$S" n; wait_for "is unchanged"

# Every view.
tmux send-keys -t "$S" 1; wait_for "1 threshold radius vs χ"; wait_for "r_crit (pc)"
tmux send-keys -t "$S" 2; wait_for "2 cooling curve"; wait_for "T (K)"
tmux send-keys -t "$S" 3; wait_for "3 timescale ratios"; wait_for "t_cool,mix/t_cc"
tmux send-keys -t "$S" 4; wait_for "4 regime map"; wait_for "criteria predict survival"
tmux send-keys -t "$S" m; wait_for "(χ × Mach)"
tmux send-keys -t "$S" 5; wait_for "5 evolution vs t/t_cc"; wait_for "cloud velocity v/v_w"
tmux send-keys -t "$S" 6; wait_for "6 simulation plan"; wait_for "core-hours"
tmux send-keys -t "$S" '?'; wait_for "? or esc close"; tmux send-keys -t "$S" Escape; wait_gone "? or esc close"

# The outflow view: the wind's inputs (χ, Mach, P/k_B set by the wind), a coarse step of SFR (×10^0.5)
# redraws the chart, x exports it, c shows the carried cloud, which exports as a PNG.
# chart_area: the chart pane's rows at 120×40 (right of the 40-column inputs pane).
chart_area() { screen | sed -n 3,22p | cut -c42-; }
tmux send-keys -t "$S" 7; wait_for "7 outflow: r_crit vs r/R"; wait_for "━ criteria disagree"
wait_for "Criteria along the wind"; wait_for "set by the wind"; wait_for "cautions, wind from memory"
tmux send-keys -t "$S" Home; wait_for "SFR      10 M☉ yr⁻¹"
chart_before=$(chart_area)
tmux send-keys -t "$S" S-Right; wait_for "SFR      31.6 M☉ yr⁻¹"
for _ in $(seq 1 200); do [ "$(chart_area)" != "$chart_before" ] && break; sleep 0.05; done
[ "$(chart_area)" != "$chart_before" ] || fail "the outflow chart did not change with SFR"
tmux send-keys -t "$S" x; wait_for "export chart to (.svg or .png)"
tmux send-keys -t "$S" -l "$out/outflow.svg"; tmux send-keys -t "$S" Enter
wait_for "exported the chart to $out/outflow.svg"
grep -qF "criteria disagree" "$out/outflow.svg" || fail "the outflow figure does not name the zone where the criteria disagree"
grep -qF "SFR = 31.6" "$out/outflow.svg" || fail "the outflow figure's caption lacks the new SFR"
tmux send-keys -t "$S" c; wait_for "7 outflow: carried cloud vs r/R"; wait_for "fate of the carried cloud"
tmux send-keys -t "$S" x; wait_for "export chart to (.svg or .png)"
tmux send-keys -t "$S" -l "$out/carried.png"; tmux send-keys -t "$S" Enter
wait_for "exported the chart to $out/carried.png"
[ "$(head -c 4 "$out/carried.png" | tail -c 3)" = "PNG" ] || fail "the carried-cloud figure is not a PNG"
tmux send-keys -t "$S" c; wait_for "7 outflow: r_crit vs r/R"
tmux send-keys -t "$S" BTab   # the chart pane: its details are the outflow's
tmux send-keys -t "$S" d; wait_for "from memory, not checked against the paper"; wait_for "⚠ caution:"
tmux send-keys -t "$S" Escape; wait_gone "⚠ caution:"; tmux send-keys -t "$S" Tab

# Simulation outcomes: the demo (the prompt suggests it), glyphs on charts 1 and 4, scores; O again clears them.
tmux send-keys -t "$S" 1; wait_for "1 threshold radius vs χ"
tmux send-keys -t "$S" O; wait_for "load simulation outcomes from"
tmux send-keys -t "$S" Enter; wait_for "loaded 12 simulation runs from fictional demo"
wait_for "✓ run grew/survived"; wait_for "✗ destroyed"; wait_for "runs ok"
tmux send-keys -t "$S" 4; wait_for "4 regime map"; wait_for "✓ run grew/survived"
screen | grep -qF "? depends on constants or conventions" || fail "the regime map does not mark cells that depend on constants or conventions"
tmux send-keys -t "$S" O; wait_for "cleared the simulation outcomes"; wait_gone "run grew/survived"
tmux send-keys -t "$S" O; wait_for "load simulation outcomes from"
tmux send-keys -t "$S" -l "$out/none.csv"; tmux send-keys -t "$S" Enter
wait_for "✗ open $out/none.csv"  # the reason in the status line

# Resizes: compact (every curve named, the full-screen chart), then too small, then back.
tmux resize-window -t "$S" -x 80 -y 24; wait_for "Criteria"
[ "$(screen | wc -L)" -le 80 ] || fail "a line is wider than 80 columns at 80×24"
tmux send-keys -t "$S" 1; wait_for "Farber & Gronke 2022"; wait_for "Abruzzo et al. 2023"
tmux send-keys -t "$S" z; wait_for "full-screen chart"
tmux send-keys -t "$S" Right; wait_for "criteria predict survival"
screen | grep -qF "Criteria" && fail "the full-screen chart still shows the criteria pane"
tmux send-keys -t "$S" z; wait_for "Criteria"
tmux resize-window -t "$S" -x 30 -y 10; wait_for "terminal too small"
tmux resize-window -t "$S" -x 120 -y 40; wait_for "Criteria"

# Quit: status 0 and the terminal restored (alternate screen left, shell output back).
tmux send-keys -t "$S" q
for _ in $(seq 1 200); do [ -s "$out/status" ] && break; sleep 0.05; done
[ -s "$out/status" ] || fail "the explorer did not exit"
grep -qx "exit=0" "$out/status" || fail "exit status: $(cat "$out/status")"
[ "$(tmux display -p -t "$S" '#{alternate_on}')" = "0" ] || fail "still in the alternate screen after quitting"
wait_for "SHELL-BEFORE-EXPLORER"
screen | grep -qF "Criteria" && fail "the explorer's frame is still on the screen after quitting"
tmux kill-session -t "$S"

# --ascii: nothing but ASCII on screen, in every view.
tmux -u new-session -d -s "$S" -x 80 -y 24 "'$bin' --ascii --chi 100 --radius '5 pc' --cooling builtin; sleep 30"
wait_for "Criteria"
for v in 1 2 3 4 5 6 7 c; do
  tmux send-keys -t "$S" "$v"
  if [ "$v" = c ]; then wait_for "7 outflow: carried cloud"; else wait_for "chart $v/7"; fi
  if screen | LC_ALL=C grep -q '[^ -~]'; then fail "non-ASCII text with --ascii in view $v"; fi
done
tmux send-keys -t "$S" O; wait_for "load simulation outcomes from"; tmux send-keys -t "$S" Enter
wait_for "loaded 12 simulation runs"
for v in 1 4; do
  tmux send-keys -t "$S" "$v"; wait_for "S run grew/survived"
  if screen | LC_ALL=C grep -q '[^ -~]'; then fail "non-ASCII text with --ascii and outcomes in view $v"; fi
done
tmux send-keys -t "$S" q
echo "e2e: ok (start, χ and r_cl steps changed the threshold and verdict, typing replaced the value, 7 views, map axes, help, the outflow view redrawn by an SFR step and exported as SVG, its carried cloud as PNG, its details, demo outcomes on charts 1 and 4 with scores, cleared, a missing outcomes file reported, export and the overwrite question, resize 80×24 with every legend entry and the full-screen chart, 30×10, quit with status 0, terminal restored, --ascii all ASCII with outcomes too)"
