#!/usr/bin/env Rscript
# Example Touchstone adapter in R (base R only).
#
# Touchstone runs this script as an external command learner (see docs/outside-learners.md):
#
#   Rscript correlation_skeleton.R --data DATA.csv --output GRAPH.csv --seed N --threshold T \
#       [--kinds KINDS.csv] [--knowledge KNOWLEDGE.json]
#
# It reads the data set (CSV, header row of variable names, empty cell = missing), joins every
# pair of variables whose absolute Pearson correlation over the rows complete for that pair
# exceeds the threshold (discrete columns, as the kinds file says, by their category codes;
# pairs the knowledge forbids in both directions are never joined), and writes the result as a CPDAG of undirected edges in Touchstone's
# CSV edge-list shape (node_a, node_b, mark_a, mark_b). It is a stand-in for YOUR method:
# replace learn() with your own search and keep the reading and writing as they are.

args <- commandArgs(trailingOnly = TRUE)
option <- function(name, default = NULL) {
  i <- match(paste0("--", name), args)
  if (is.na(i)) {
    if (is.null(default)) stop(paste0("missing --", name))
    return(default)
  }
  args[i + 1]
}

data_file <- option("data")
output_file <- option("output")
seed <- as.numeric(option("seed", "0"))
threshold <- as.numeric(option("threshold", "0.3"))
set.seed(seed %% .Machine$integer.max)  # use R's generator for any randomness: runs stay reproducible

kinds_file <- option("kinds", "")
knowledge_file <- option("knowledge", "")

data <- read.csv(data_file, check.names = FALSE, na.strings = "", colClasses = "character")
kinds <- if (nzchar(kinds_file)) read.csv(kinds_file, colClasses = "character") else
  data.frame(column = character(), kind = character())
for (name in colnames(data)) {
  if (name %in% kinds$column[kinds$kind == "discrete"]) {
    data[[name]] <- as.numeric(factor(data[[name]]))  # category codes
  } else {
    data[[name]] <- as.numeric(data[[name]])
  }
}
# The knowledge file is JSON (required, forbidden, tiers); base R has no JSON reader, so it
# is used only when the jsonlite package is installed.
forbidden <- list()
if (nzchar(knowledge_file) && requireNamespace("jsonlite", quietly = TRUE)) {
  k <- jsonlite::fromJSON(knowledge_file, simplifyVector = FALSE)
  forbidden <- lapply(k$forbidden, function(pair) paste(pair[[1]], pair[[2]]))
}

learn <- function(data, threshold) {
  # Your method goes here. Return a data frame of edges: node_a, node_b, mark_a, mark_b.
  r <- suppressWarnings(cor(data, use = "pairwise.complete.obs"))
  r[is.na(r)] <- 0
  names <- colnames(data)
  edges <- data.frame(node_a = character(), node_b = character(), mark_a = character(),
                      mark_b = character(), stringsAsFactors = FALSE)
  p <- ncol(data)
  if (p >= 2) {
    for (i in 1:(p - 1)) {
      for (j in (i + 1):p) {
        both_forbidden <- paste(names[i], names[j]) %in% forbidden && paste(names[j], names[i]) %in% forbidden
        if (!both_forbidden && abs(r[i, j]) > threshold) {
          edges[nrow(edges) + 1, ] <- c(names[i], names[j], "tail", "tail")
        }
      }
    }
  }
  edges
}

write.csv(learn(data, threshold), output_file, row.names = FALSE, quote = TRUE)
