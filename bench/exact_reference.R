# Reference timings for the exact-test bench: R's fisher.test on every table of the suite.
# R (Debian r-base-core) is used only as a yardstick here, never by Assoc itself.
# Usage: Rscript bench/exact_reference.R bench/exact_suite.txt > build/bench/exact_r.csv
# For each table: fisher.test with its default workspace (200000); if that fails, again with a
# large workspace (2e8). Fast runs are repeated and the median kept. Where the two disagree by
# more than 1e-6 the bench wants a third opinion, so a Monte Carlo p from R's own
# simulate.p.value (B = 1e6, fixed seed) is printed for every table.
args <- commandArgs(trailingOnly = TRUE)
lines <- readLines(args[1])
lines <- lines[!grepl("^#", lines) & nchar(lines) > 0]
timed <- function(m, workspace) {
  times <- c(); p <- NA; status <- "ok"
  for (i in 1:3) {
    t <- system.time(r <- tryCatch(fisher.test(m, workspace = workspace)$p.value,
                                    error = function(e) conditionMessage(e)))[["elapsed"]]
    if (is.character(r)) { status <- "failed"; p <- NA; times <- t; break }
    p <- r; times <- c(times, t)
    if (t > 1) break
  }
  list(status = status, time = median(times), p = p)
}
cat("name,default_status,default_seconds,default_p,large_status,large_seconds,large_p,simulated_p\n")
for (l in lines) {
  f <- strsplit(l, " ")[[1]]
  m <- matrix(as.numeric(f[4:length(f)]), nrow = as.integer(f[2]), byrow = TRUE)
  d <- timed(m, 200000)
  g <- if (d$status == "ok") list(status = "skipped", time = NA, p = NA) else timed(m, 2e8)
  set.seed(20261201)
  s <- fisher.test(m, simulate.p.value = TRUE, B = 1e6)$p.value
  cat(sprintf("%s,%s,%.4f,%.17g,%s,%.4f,%.17g,%.17g\n", f[1], d$status, d$time, d$p, g$status,
              ifelse(is.na(g$time), NA, g$time), g$p, s))
  flush(stdout())
}
